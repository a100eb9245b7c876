import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type CaughtMail = { id: number; from: string; to: string[]; subject: string; text: string; receivedAt: string };

export const getMailbox = () => api.get<CaughtMail[]>('/dev/mailbox');

export const mailboxQueryOptions = () => queryOptions({ queryKey: ['dev', 'mailbox'], queryFn: getMailbox, refetchInterval: 5_000, staleTime: 0 });

export const useMailbox = () => useQuery(mailboxQueryOptions());
