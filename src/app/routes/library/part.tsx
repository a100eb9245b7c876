import { PartPage } from '../../../features/library/components/part-page';

/** Lazy route module: /parts/:partId */
export function Component() {
  return <PartPage />;
}
