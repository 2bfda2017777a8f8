import { useQuery } from '@tanstack/react-query';
import { useEffect } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { formatDuration, formatNumber } from '../../../lib/format-number';
import { isApiError } from '../../../lib/api';
import { formatPlantTime } from '../../../lib/plant-time';
import type { Loop } from '../../loops/api/get-loops';
import { FORECAST_SAMPLES, forecastQueryOptions, type Forecast } from '../api/get-forecast';
import { overlayOf } from '../utils/chart-data';
import type { LiveTrend } from '../utils/live-trend';

const valueWithUnit = (value: number | undefined, unit: string) =>
  value === undefined ? '—' : `${formatNumber(value)}${unit ? ` ${unit}` : ''}`;

/** The forecast starts from the twin's persisted state; say so when that lags the newest samples. */
function stateLag(forecast: Forecast, trend: LiveTrend, samplePeriodS: number): number {
  const times = trend.rows()[0];
  const start = Date.parse(forecast.t[0] ?? '') / 1000;
  if (!times.length || !Number.isFinite(start)) return 0;
  return Math.floor((times[times.length - 1] - start) / samplePeriodS) + 1;
}

function ForecastFacts({ loop, forecast, trend }: { loop: Loop; forecast: Forecast; trend: LiveTrend }) {
  const end = forecast.t[forecast.t.length - 1];
  const lag = stateLag(forecast, trend, loop.samplePeriodS);
  const held = loop.inputs.map((s, i) => `${s.name} ${valueWithUnit(forecast.u[i], s.unit)}`).join(', ');
  return (
    <>
      <p>
        {formatDuration(FORECAST_SAMPLES * loop.samplePeriodS)} ahead, to{' '}
        {end ? formatPlantTime(Date.parse(end), loop.timeZone, { seconds: false }) : '—'}, with the inputs held at{' '}
        {held}.
      </p>
      <ul className="space-y-0.5 tabular-nums">
        {loop.outputs.map((s, i) => (
          <li key={s.name}>
            <span className="font-medium">{s.name}</span>: {valueWithUnit(forecast.y[i]?.[0], s.unit)} →{' '}
            {valueWithUnit(forecast.y[i]?.at(-1), s.unit)}
          </li>
        ))}
      </ul>
      {lag > 2 ? (
        <p className="text-xs text-drifting">
          It starts from the twin&apos;s state of {lag} samples ago, the newest the stepping service has stored.
        </p>
      ) : null}
    </>
  );
}

/** "Next 60 samples": the twin's forecast with the inputs held, drawn into the charts in the twin colour. */
export function ForecastPanel({ loop, trend }: { loop: Loop; trend: LiveTrend }) {
  const enabled = trend.live && loop.activeVersionId !== null;
  const forecast = useQuery(forecastQueryOptions(loop.id, loop.samplePeriodS, enabled));
  const shown = enabled ? forecast.data : undefined;
  useEffect(() => trend.setOverlays({ forecast: shown ? overlayOf(shown) : null }), [trend, shown]);

  let body;
  if (!enabled) {
    body = (
      <p>
        {trend.live
          ? 'This loop has no active model version, so there is no twin to forecast with.'
          : 'Forecasts show with a live range (15 min … 7 days).'}
      </p>
    );
  } else if (forecast.isError) {
    body =
      isApiError(forecast.error) && forecast.error.status === 409 ? (
        <p>
          No forecast yet: the twin of {loop.tag} has not started stepping. It starts once the stepping service picks up
          the active version.
        </p>
      ) : (
        <p role="alert">{describeError(forecast.error).explanation}</p>
      );
  } else if (!forecast.data) {
    body = <p>Asking the twin…</p>;
  } else {
    body = <ForecastFacts loop={loop} forecast={forecast.data} trend={trend} />;
  }
  return (
    <section
      aria-label={`Next ${FORECAST_SAMPLES} samples`}
      className="space-y-2 rounded-sm border border-rule border-t-4 border-t-twin bg-panel px-3 py-2 text-sm"
    >
      <h2 className="font-bold">Next {FORECAST_SAMPLES} samples</h2>
      <p className="inline-block rounded-sm bg-twin/10 px-1.5 py-0.5 text-xs font-medium text-twin">
        Model prediction, not a measurement
      </p>
      {body}
    </section>
  );
}
