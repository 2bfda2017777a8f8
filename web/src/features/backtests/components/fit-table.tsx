import { Table, Td, Th } from '../../../components/ui/table';
import type { ReplayRun } from '../types';
import { count, fitText, whitenessText, withUnit } from '../utils/backtest-words';

/** One replay's figures per output: fit, RMSE and the residual's mean, spread and whiteness, in the output's unit. */
export function FitTable({ title, run }: { title: string; run: ReplayRun }) {
  return (
    <section aria-label={title} className="space-y-1">
      <h4 className="text-sm font-bold">{title}</h4>
      <Table caption={title}>
        <thead>
          <tr>
            <Th>Output</Th>
            <Th>Fit</Th>
            <Th>RMSE</Th>
            <Th>Residual mean</Th>
            <Th>Residual std</Th>
            <Th>Samples scored</Th>
            <Th>Whiteness</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {run.outputs.map((o) => (
            <tr key={o.name}>
              <Td>{o.name}</Td>
              <Td className="font-bold">{fitText(o.fitPercent)}</Td>
              <Td>{withUnit(o.rmse, o.unit)}</Td>
              <Td>{withUnit(o.residualMean, o.unit)}</Td>
              <Td>{withUnit(o.residualStd, o.unit)}</Td>
              <Td>{count(o.scored)}</Td>
              <Td>{whitenessText(o.autocorrelation)}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}
