import { useMe } from '../../../features/auth/api/get-me';
import { MembersPage } from '../../../features/team/components/members-page';

/** Lazy route module: /teams/:teamId/members (leads and site admins also see invitations and the audit trail) */
export function Component() {
  const me = useMe();
  return <MembersPage isAdmin={me.data?.user?.isAdmin ?? false} />;
}
