import { Link, useMatches } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths, type PathKey } from '../../config/paths.ts';
import { navItem } from '../nav-items.ts';

/** Set on a route by the router: which navigation entry this placeholder stands for. */
export interface ComingSoonHandle {
  navKey: PathKey;
}

export function Component() {
  const handle = useMatches().at(-1)?.handle as ComingSoonHandle | undefined;
  if (!handle) throw new Error('A coming-soon route needs a ComingSoonHandle');
  const item = navItem(handle.navKey);
  return (
    <>
      <PageHeader title={item.label} description={item.summary} />
      <EmptyState
        title={`${item.label} is coming soon`}
        action={<Link to={paths.overview.getHref()}>Back to the overview</Link>}
      >
        This page is being built. Its address will stay the same, so a bookmark made now will keep working.
      </EmptyState>
    </>
  );
}
