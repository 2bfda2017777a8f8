import { Table, Td, Th } from '../../../../components/ui/table';
import { plural } from '../../../../lib/format-number';
import type { UploadProblem } from '../../types';

/** Every problem of a refused upload, with where it is, so the file can be fixed in one pass. */
export function UploadProblems({ problems }: { problems: UploadProblem[] }) {
  return (
    <div role="alert" className="space-y-2">
      <p className="font-bold text-diverged">
        The files were not read: {plural(problems.length, 'problem')} to fix. Correct the files and choose them again.
      </p>
      <Table caption="Problems in the uploaded files">
        <thead>
          <tr>
            <Th>File</Th>
            <Th>Row</Th>
            <Th>Column</Th>
            <Th>Problem</Th>
          </tr>
        </thead>
        <tbody>
          {problems.map((problem, index) => (
            <tr key={index}>
              <Td>{problem.file ?? 'all files'}</Td>
              <Td className="tabular-nums">{problem.row ?? '—'}</Td>
              <Td className="tabular-nums">{problem.column ?? '—'}</Td>
              <Td>{problem.message}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
