import { useState, type FormEvent } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { NewTokenNotice } from '../../../components/ui/new-token-notice';
import { useCreateIngestSource, type CreatedIngestSource } from '../api/create-ingest-source';
import { LoopPicker } from './loop-picker';

/** Name, description and loops; the token comes back once. */
export function CreateIngestSourceForm() {
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const [loopIds, setLoopIds] = useState<string[]>([]);
  const [created, setCreated] = useState<CreatedIngestSource | null>(null);
  const create = useCreateIngestSource();

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    create.mutate(
      { name: name.trim(), description: description.trim(), loopIds },
      {
        onSuccess: (source) => {
          setCreated(source);
          setName('');
          setDescription('');
          setLoopIds([]);
        },
      },
    );
  };

  return (
    <div className="space-y-3">
      <form
        onSubmit={submit}
        aria-label="New ingest source"
        className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3"
      >
        <h2 className="font-bold">New ingest source</h2>
        <div className="flex flex-wrap gap-3 text-sm">
          <label className="flex flex-col gap-1">
            <span className="font-medium">Name</span>
            <input
              value={name}
              onChange={(e) => setName(e.target.value)}
              required
              maxLength={80}
              placeholder="e.g. historian bridge, aeration"
              className={`w-72 ${INPUT_CLASSES}`}
            />
          </label>
          <label className="flex min-w-72 flex-1 flex-col gap-1">
            <span className="font-medium">Description</span>
            <input
              value={description}
              onChange={(e) => setDescription(e.target.value)}
              maxLength={500}
              placeholder="Where it runs and who looks after it"
              className={INPUT_CLASSES}
            />
          </label>
        </div>
        <LoopPicker selected={loopIds} onChange={setLoopIds} legend="Loops it may post readings for" />
        <Button type="submit" variant="primary" disabled={create.isPending || name.trim() === ''}>
          Create source and token
        </Button>
        {create.isError ? (
          <p role="alert" className="text-sm text-diverged">
            {describeError(create.error).explanation}
          </p>
        ) : null}
      </form>
      {created ? (
        <NewTokenNotice
          created={{ label: created.name, token: created.token }}
          reach={`It may post readings for ${created.loops.length ? created.loops.map((l) => l.tag).join(', ') : 'no loop yet'} and nothing else.`}
          onDismiss={() => setCreated(null)}
        />
      ) : null}
    </div>
  );
}
