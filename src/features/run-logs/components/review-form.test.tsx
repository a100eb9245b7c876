// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { RunLogDetail } from '../api/run-logs-api';
import { ReviewSection } from './review-form';

const runLog = { id: 7, review: null, role: 'lead' } as unknown as RunLogDetail;

describe('ReviewSection', () => {
  it('asks before recording a decision that cannot be undone, and going back records nothing', async () => {
    const client = new QueryClient();
    render(
      <QueryClientProvider client={client}>
        <ReviewSection runLog={runLog} />
      </QueryClientProvider>,
    );
    await userEvent.click(screen.getByLabelText(/Scrap/));
    await userEvent.type(screen.getByLabelText(/^Rationale/), 'Porosity at the lagging TC well beyond what the part allows.');
    await userEvent.click(screen.getByRole('button', { name: 'Record the decision…' }));
    expect(screen.getByTestId('review-confirm').textContent).toContain('Record “Scrap” on this run? It cannot be changed or withdrawn afterwards.');
    // while asking, the choice is frozen
    expect((screen.getByLabelText(/Use as is/) as HTMLInputElement).disabled).toBe(true);
    await userEvent.click(screen.getByRole('button', { name: 'Go back' }));
    expect(screen.queryByTestId('review-confirm')).toBeNull();
    expect(client.getMutationCache().getAll()).toHaveLength(0);
  });
});
