/** A dense real matrix stored as an array of rows (JSON-friendly; every row has the same length). */
export type Matrix = number[][];

/** A complex number; the API writes complex values as `{ "re": …, "im": … }`. */
export interface Complex {
  re: number;
  im: number;
}

/**
 * A discrete-time linear state-space model `x(k+1) = A x(k) + B u(k)`, `y(k) = C x(k) + D u(k)`,
 * acting on deviations from an operating point: readings and states are in engineering units, and
 * the model sees `x − x0`, `u − u0` and produces `y − y0`.
 *
 * Defaults: `C = I` (every state is an output), `D = 0`, `x0` and `u0` zero vectors, and
 * `y0 = C x0 + D u0` (the output at the operating point, so that then `y = C x + D u` in engineering units).
 */
export interface StateSpaceModel {
  /** n×n state matrix. */
  A: Matrix;
  /** n×m input matrix. */
  B: Matrix;
  /** p×n output matrix; the identity when omitted. */
  C?: Matrix;
  /** p×m feedthrough matrix; zero when omitted. */
  D?: Matrix;
  /** Operating-point state (length n). */
  x0?: number[];
  /** Operating-point input (length m). */
  u0?: number[];
  /** Operating-point output (length p); `C x0 + D u0` when omitted. */
  y0?: number[];
}
