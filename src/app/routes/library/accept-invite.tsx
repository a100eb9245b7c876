import { useMe } from '../../../features/auth/api/get-me';
import { AcceptInvitePage } from '../../../features/team/components/accept-invite-page';

/** Lazy route module: /invite/:token (the link in the invitation mail) */
export function Component() {
  const me = useMe();
  return <AcceptInvitePage signedIn={me.data ? me.data.user !== null : null} />;
}
