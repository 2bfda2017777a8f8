import { useQuery } from '@tanstack/react-query';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatPlantTime } from '../../../lib/plant-time';
import { suppressionsQueryOptions } from '../api/get-suppressions';
import { RULE_WORDS } from '../utils/alert-words';

/** What the rules raised while the loop was in maintenance: recorded, nobody called. */
export function SuppressedRaises({ loopId, timeZone }: { loopId: string; timeZone: string }) {
  const raises = useQuery(suppressionsQueryOptions(loopId));
  if (!raises.data?.length) return null;
  return (
    <section aria-label="Raises during maintenance" className="space-y-1">
      <h2 className="font-bold">Raises recorded during maintenance (nobody was called)</h2>
      <Table caption="Raises recorded during maintenance">
        <thead>
          <tr>
            <Th>When ({timeZone})</Th>
            <Th>Rule</Th>
            <Th>What happened</Th>
          </tr>
        </thead>
        <tbody>
          {raises.data.map((raise) => (
            <tr key={raise.id}>
              <Td className="whitespace-nowrap tabular-nums">
                {formatPlantTime(Date.parse(raise.at), timeZone, { date: true, seconds: false })}
              </Td>
              <Td>{RULE_WORDS[raise.rule]}</Td>
              <Td>{raise.summary}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}
