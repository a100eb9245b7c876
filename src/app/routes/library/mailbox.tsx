import { MailboxPage } from '../../../features/team/components/mailbox-page';

/** Lazy route module: /dev/mailbox (only answers while the local fake mail server is in use) */
export function Component() {
  return <MailboxPage />;
}
