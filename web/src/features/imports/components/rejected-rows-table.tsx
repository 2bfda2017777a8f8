import { Table, Td, Th } from '../../../components/ui/table';

/** The rows of an uploaded CSV that were refused, by line (the header is line 1) and reason. */
export function RejectedRowsTable({ rows, caption }: { rows: { line: number; reason: string }[]; caption: string }) {
  return (
    <Table caption={caption}>
      <thead>
        <tr>
          <Th>Line</Th>
          <Th>Why it was rejected</Th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.line}>
            <Td className="tabular-nums">{row.line}</Td>
            <Td>{row.reason}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
