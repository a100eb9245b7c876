import { useState } from 'react';
import { fmtTime } from '../../../lib/format-time';
import { refusalOf, useDecideReview, type ReviewDecision, type RunLogDetail } from '../api/run-logs-api';

const DECISIONS: { value: ReviewDecision; label: string; hint: string }[] = [
  { value: 'use-as-is', label: 'Use as is', hint: 'the part meets its requirements despite the excursion' },
  { value: 'rework', label: 'Rework', hint: 'e.g. a post-cure or a repair brings it back' },
  { value: 'scrap', label: 'Scrap', hint: 'the part cannot be accepted' },
];

/** The decision on a run: recorded once by a lead, then shown read-only to everyone. */
export function ReviewSection({ runLog }: { runLog: RunLogDetail }) {
  const decide = useDecideReview(String(runLog.id));
  const [decision, setDecision] = useState<ReviewDecision | null>(null);
  const [rationale, setRationale] = useState('');
  // a decision cannot be undone: the first press asks, the second records
  const [confirming, setConfirming] = useState(false);

  if (runLog.review) {
    const r = runLog.review;
    return (
      <div data-testid="review-decision">
        <p className="mt-2">
          <span className="rounded bg-slate-soft px-2 py-0.5 font-medium">{DECISIONS.find((d) => d.value === r.decision)?.label ?? r.decision}</span>{' '}
          — {r.decidedBy?.name ?? 'unknown'}, {fmtTime(r.decidedAt)}
        </p>
        <p className="mt-2 whitespace-pre-wrap text-sm">{r.rationale}</p>
        <p className="mt-1 text-xs text-ink-faint">Decisions are final; a new run needs a new run log.</p>
      </div>
    );
  }
  if (runLog.role !== 'lead') {
    return (
      <p className="mt-2 text-sm text-ink-soft" data-testid="review-not-allowed">
        No decision yet. Only a lead of the team records the decision on a run (your role: {runLog.role ?? 'none'}).
      </p>
    );
  }
  const error = decide.error ? (refusalOf(decide.error)?.error ?? decide.error.message) : null;
  return (
    <form
      className="mt-2"
      data-testid="review-form"
      onSubmit={(e) => {
        e.preventDefault();
        if (decision) setConfirming(true);
      }}
    >
      <fieldset className="flex flex-wrap gap-4">
        <legend className="sr-only">Decision</legend>
        {DECISIONS.map((d) => (
          <label key={d.value} className="flex items-start gap-1.5 text-sm">
            <input
              type="radio"
              name="decision"
              value={d.value}
              checked={decision === d.value}
              disabled={confirming}
              onChange={() => setDecision(d.value)}
            />
            <span>
              <span className="font-medium">{d.label}</span>
              <span className="block text-xs text-ink-faint">{d.hint}</span>
            </span>
          </label>
        ))}
      </fieldset>
      <label className="mt-3 block text-sm">
        Rationale <span className="text-ink-faint">(at least 20 characters: findings weighed, replay results, coupons or tests asked for)</span>
        <textarea
          className="mt-1 block h-28 w-full rounded border border-rule bg-paper p-2"
          value={rationale}
          readOnly={confirming}
          onChange={(e) => setRationale(e.target.value)}
        />
      </label>
      {error && <p role="alert" className="mt-2 text-sm text-fault">{error}</p>}
      {confirming && decision ? (
        <div className="mt-2 rounded border border-fault-soft bg-fault-soft/30 p-3 text-sm" data-testid="review-confirm">
          <p className="font-medium">
            Record “{DECISIONS.find((d) => d.value === decision)!.label}” on this run? It cannot be changed or withdrawn afterwards.
          </p>
          <div className="mt-2 flex gap-2">
            <button
              type="button"
              className="rounded bg-fault px-3 py-1.5 font-medium text-paper disabled:opacity-50"
              disabled={decide.isPending}
              onClick={() => decide.mutate({ decision, rationale })}
            >
              Yes, record it
            </button>
            <button type="button" className="rounded border border-rule px-3 py-1.5" disabled={decide.isPending} onClick={() => setConfirming(false)}>
              Go back
            </button>
          </div>
        </div>
      ) : (
        <button
          type="submit"
          className="mt-2 rounded bg-slate px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-50"
          disabled={!decision || rationale.trim().length < 20}
        >
          Record the decision…
        </button>
      )}
      <p className="mt-1 text-xs text-ink-faint">Once recorded, the decision cannot be changed.</p>
    </form>
  );
}
