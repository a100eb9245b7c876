import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { useCreateStudy } from '../api/create-study';
import type { PartDetail } from '../api/get-part';

const input = 'rounded border border-rule bg-paper-raised px-2 py-1';

/** Engineers and leads start a study in this part: from the reference study, or from a revision of one of its studies. */
export function NewStudyForm({ part }: { part: PartDetail }) {
  const [title, setTitle] = useState('');
  const [from, setFrom] = useState<'reference' | 'revision'>('reference');
  const [studyId, setStudyId] = useState<number | null>(part.studies[0]?.id ?? null);
  const source = part.studies.find((s) => s.id === studyId);
  const [number, setNumber] = useState<number | null>(null);
  const chosenNumber = number ?? source?.latestRevisionNumber ?? 1;
  const create = useCreateStudy();
  const navigate = useNavigate();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const onSuccess = (made: { id: number }) => navigate(`/studies/${made.id}`);
    if (from === 'revision' && studyId !== null) create.mutate({ partId: part.id, title, from, studyId, number: chosenNumber }, { onSuccess });
    else create.mutate({ partId: part.id, title, from: 'reference' }, { onSuccess });
  };
  return (
    <form onSubmit={submit} aria-label="New study" className="mt-2 flex flex-wrap items-end gap-2 text-sm">
      <label className="flex flex-col">
        Title
        <input required maxLength={160} value={title} onChange={(e) => setTitle(e.target.value)} className={input} />
      </label>
      <label className="flex flex-col">
        Start from
        <select aria-label="Start from" value={from} onChange={(e) => setFrom(e.target.value as 'reference' | 'revision')} className={input}>
          <option value="reference">the reference study</option>
          {part.studies.length > 0 && <option value="revision">a revision of this part's studies</option>}
        </select>
      </label>
      {from === 'revision' && source && (
        <>
          <label className="flex flex-col">
            Study
            <select aria-label="Source study" value={studyId ?? ''} onChange={(e) => { setStudyId(Number(e.target.value)); setNumber(null); }} className={input}>
              {part.studies.map((s) => <option key={s.id} value={s.id}>{s.title}</option>)}
            </select>
          </label>
          <label className="flex flex-col">
            Revision
            <select aria-label="Source revision" value={chosenNumber} onChange={(e) => setNumber(Number(e.target.value))} className={input}>
              {Array.from({ length: source.latestRevisionNumber }, (_, i) => source.latestRevisionNumber - i).map((n) => <option key={n} value={n}>r{n}</option>)}
            </select>
          </label>
        </>
      )}
      <button type="submit" disabled={create.isPending} className="rounded bg-ink px-3 py-1 text-paper">Create study</button>
      {create.isError && <p role="alert" className="w-full text-fault">Not created: {create.error.message}</p>}
    </form>
  );
}
