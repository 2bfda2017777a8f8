import { useMemo, useState } from 'react';
import { seriesColour, timeLineOptions } from '../../../../components/charts/chart-theme';
import { UPlotChart } from '../../../../components/charts/uplot-chart';
import { INPUT_CLASSES } from '../../../../components/ui/field';
import type { ModalPart } from '../../types';
import { stackModeContributions } from '../../utils/stack-contributions';

type FreeResponseProps = {
  trajectory: number[][];
  modal: ModalPart[] | null;
  modalError: string | null;
  stateLabels: string[];
  samplePeriodS: number;
};

/** x(k) = A^k x0 per state, and one state's free response split into its modes, stacked. */
export function FreeResponseCharts({ trajectory, modal, modalError, stateLabels, samplePeriodS }: FreeResponseProps) {
  const [state, setState] = useState(0);
  const t = useMemo(() => trajectory.map((_, k) => k * samplePeriodS), [trajectory, samplePeriodS]);
  const labelsKey = stateLabels.join('|');
  const trajectoryOptions = useMemo(
    () =>
      timeLineOptions({
        yLabel: 'state deviation',
        lines: labelsKey.split('|').map((label, i) => ({ label, colour: seriesColour(i) })),
      }),
    [labelsKey],
  );
  const trajectoryData = useMemo(
    () => [t, ...stateLabels.map((_, i) => trajectory.map((x) => x[i]))] as [number[], ...number[][]],
    [t, trajectory, stateLabels],
  );
  const stacked = useMemo(() => (modal ? stackModeContributions(modal, state) : null), [modal, state]);
  const splitOptions = useMemo(() => {
    if (!stacked) return null;
    const lines = [
      { label: 'operating point', colour: '#d5d9d2', width: 1 },
      ...stacked.labels.map((label, i) => ({ label: i === 0 ? label : `+ ${label}`, colour: seriesColour(i + 1) })),
    ];
    const bands = stacked.labels.map((_, i) => ({
      series: [i + 2, i + 1] as [number, number],
      fill: `${seriesColour(i + 1)}33`,
    }));
    return timeLineOptions({ yLabel: stateLabels[state] ?? 'state', lines, bands });
  }, [stacked, stateLabels, state]);
  const splitData = useMemo(
    () => (stacked ? ([t, t.map(() => 0), ...stacked.layers] as [number[], ...number[][]]) : null),
    [stacked, t],
  );

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <figure className="min-w-0 rounded-sm border border-rule bg-panel p-2">
        <figcaption className="mb-1 text-sm font-bold">Free response x(k) = A^k x0</figcaption>
        <UPlotChart options={trajectoryOptions} data={trajectoryData} height={220} />
      </figure>
      <figure className="min-w-0 space-y-1 rounded-sm border border-rule bg-panel p-2">
        <figcaption className="text-sm">
          <span className="font-bold">The same response split into modes</span>
          <span className="block text-ink/80">
            Each band is one mode&apos;s share; the top line is the sum, the state itself.
          </span>
        </figcaption>
        {modal && splitOptions && splitData ? (
          <>
            <label className="flex items-center gap-2 text-sm">
              <span className="font-medium">State</span>
              <select value={state} onChange={(e) => setState(Number(e.target.value))} className={INPUT_CLASSES}>
                {stateLabels.map((label, i) => (
                  <option key={label} value={i}>
                    {label}
                  </option>
                ))}
              </select>
            </label>
            <UPlotChart options={splitOptions} data={splitData} height={200} />
          </>
        ) : (
          <p className="text-sm">
            The modes cannot be separated for this model: {modalError ?? 'no mode split was returned'}.
          </p>
        )}
      </figure>
    </div>
  );
}
