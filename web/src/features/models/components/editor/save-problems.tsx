import { describeError } from '../../../../components/errors/describe-error';
import type { ServerModelProblems } from '../../utils/server-model-problems';
import type { EditorProblem } from '../../utils/version-body';

type SaveProblemsProps = { problems: EditorProblem[]; server: ServerModelProblems; error: unknown };

/** Why the version was not saved: first what the editor found, then what the server found. */
export function SaveProblems({ problems, server, error }: SaveProblemsProps) {
  if (problems.length > 0) {
    return (
      <div role="alert" className="rounded-sm border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm">
        <p className="font-bold">Not saved yet: fill in or correct these cells.</p>
        <ul className="mt-1 list-disc pl-5">
          {problems.map((problem) => (
            <li key={problem.message}>{problem.message}</li>
          ))}
        </ul>
      </div>
    );
  }
  if (!error) return null;
  if (server.messages.length === 0) {
    const described = describeError(error);
    return (
      <p role="alert" className="rounded-sm border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm">
        <strong>{described.title}.</strong> {described.explanation} {described.nextStep}
      </p>
    );
  }
  return (
    <div role="alert" className="rounded-sm border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm">
      <p className="font-bold">The server refused the model. Correct these and save again:</p>
      <ul className="mt-1 list-disc pl-5">
        {server.messages.map((message) => (
          <li key={message}>{message}</li>
        ))}
      </ul>
    </div>
  );
}
