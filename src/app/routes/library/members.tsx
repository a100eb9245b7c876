import { MembersPage } from '../../../features/team/components/members-page';

/** Lazy route module: /teams/:teamId/members (leads also see invitations and the audit trail) */
export function Component() {
  return <MembersPage />;
}
