;; The stepper's inner loop in WebAssembly with 128-bit SIMD (two f64 lanes), for models of 16 or
;; more states plus inputs (see step.ts). `npm run build:wasm` turns this file into
;; step-kernel-wasm.ts; a unit test checks that the two agree.
;;
;; One call computes, for every row r < rows of the stacked matrix M = [A B; C D]:
;;   dev[j]  = raw[j] − op[j]                       (raw = [x; u; 0…], op = [x0; u0; 0…])
;;   out[r]  = base[r] + Σ_j M[r·W + j] · dev[j]    (base = [x0; y0], out = [x(k+1); y(k)])
;; W is the row width in doubles, a multiple of 8 (rows are zero-padded): each pass of the inner
;; loop takes 8 columns into 4 independent two-lane partial sums, so the additions do not wait on
;; each other. Every pointer is a byte offset into the imported memory, 16-byte aligned.
(module
  (import "env" "memory" (memory 1))
  (func (export "step")
    (param $M i32) (param $rows i32) (param $W i32) (param $raw i32) (param $op i32)
    (param $dev i32) (param $base i32) (param $out i32)
    (local $j i32) (local $end i32) (local $r i32) (local $row i32)
    (local $a0 v128) (local $a1 v128) (local $a2 v128) (local $a3 v128) (local $s v128)
    (local.set $end (i32.shl (local.get $W) (i32.const 3)))
    ;; deviations from the operating point, two at a time
    (local.set $j (i32.const 0))
    (block $deviations_done
      (loop $deviations
        (br_if $deviations_done (i32.ge_u (local.get $j) (local.get $end)))
        (v128.store (i32.add (local.get $dev) (local.get $j))
          (f64x2.sub
            (v128.load (i32.add (local.get $raw) (local.get $j)))
            (v128.load (i32.add (local.get $op) (local.get $j)))))
        (local.set $j (i32.add (local.get $j) (i32.const 16)))
        (br $deviations)))
    (local.set $row (local.get $M))
    (local.set $r (i32.const 0))
    (block $rows_done
      (loop $each_row
        (br_if $rows_done (i32.ge_u (local.get $r) (local.get $rows)))
        (local.set $a0 (v128.const f64x2 0 0))
        (local.set $a1 (v128.const f64x2 0 0))
        (local.set $a2 (v128.const f64x2 0 0))
        (local.set $a3 (v128.const f64x2 0 0))
        (local.set $j (i32.const 0))
        (block $columns_done
          (loop $columns
            (br_if $columns_done (i32.ge_u (local.get $j) (local.get $end)))
            (local.set $a0 (f64x2.add (local.get $a0) (f64x2.mul
              (v128.load (i32.add (local.get $row) (local.get $j)))
              (v128.load (i32.add (local.get $dev) (local.get $j))))))
            (local.set $a1 (f64x2.add (local.get $a1) (f64x2.mul
              (v128.load offset=16 (i32.add (local.get $row) (local.get $j)))
              (v128.load offset=16 (i32.add (local.get $dev) (local.get $j))))))
            (local.set $a2 (f64x2.add (local.get $a2) (f64x2.mul
              (v128.load offset=32 (i32.add (local.get $row) (local.get $j)))
              (v128.load offset=32 (i32.add (local.get $dev) (local.get $j))))))
            (local.set $a3 (f64x2.add (local.get $a3) (f64x2.mul
              (v128.load offset=48 (i32.add (local.get $row) (local.get $j)))
              (v128.load offset=48 (i32.add (local.get $dev) (local.get $j))))))
            (local.set $j (i32.add (local.get $j) (i32.const 64)))
            (br $columns)))
        (local.set $s
          (f64x2.add
            (f64x2.add (local.get $a0) (local.get $a2))
            (f64x2.add (local.get $a1) (local.get $a3))))
        (f64.store (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 3)))
          (f64.add
            (f64.load (i32.add (local.get $base) (i32.shl (local.get $r) (i32.const 3))))
            (f64.add (f64x2.extract_lane 0 (local.get $s)) (f64x2.extract_lane 1 (local.get $s)))))
        (local.set $row (i32.add (local.get $row) (local.get $end)))
        (local.set $r (i32.add (local.get $r) (i32.const 1)))
        (br $each_row)))))
