import { SignInPage } from '../../../features/auth/components/sign-in-page';

/** Lazy route module: /sign-in?next=<path> */
export function Component() {
  return <SignInPage />;
}
