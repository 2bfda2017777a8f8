import type { VersionBacktest } from '../types';

export type EvidenceFitRow = {
  name: string;
  unit: string;
  oneStep: number | null;
  activeOneStep: number | null;
  freeRun: number | null;
  activeFreeRun: number | null;
  rmse: number | null;
  activeRmse: number | null;
};

/** Per output, a version's fit and RMSE beside the active version's in the same backtest (same loop, same outputs). */
export function evidenceFitRows(version: VersionBacktest, active: VersionBacktest | null): EvidenceFitRow[] {
  return version.oneStep.outputs.map((output, i) => ({
    name: output.name,
    unit: output.unit,
    oneStep: output.fitPercent,
    activeOneStep: active?.oneStep.outputs[i]?.fitPercent ?? null,
    freeRun: version.freeRun.outputs[i]?.fitPercent ?? null,
    activeFreeRun: active?.freeRun.outputs[i]?.fitPercent ?? null,
    rmse: output.rmse,
    activeRmse: active?.oneStep.outputs[i]?.rmse ?? null,
  }));
}
