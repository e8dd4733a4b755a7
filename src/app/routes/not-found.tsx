import { Link } from 'react-router-dom';
import { EmptyState } from '../../components/ui/empty-state.tsx';
import { PageHeader } from '../../components/ui/page-header.tsx';
import { paths } from '../../config/paths.ts';

export function Component() {
  return (
    <>
      <PageHeader title="Page not found" />
      <EmptyState title="There is no page at this address" action={<Link to={paths.overview.getHref()}>Go to the overview</Link>}>
        The link may be mistyped, or the page may have moved. The navigation lists every page.
      </EmptyState>
    </>
  );
}
