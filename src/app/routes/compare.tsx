import { ComparePage } from '../../features/compare/components/compare-page';

/** Lazy route module: /compare?a=<ref>&b=<ref> */
export function Component() {
  return <ComparePage />;
}
