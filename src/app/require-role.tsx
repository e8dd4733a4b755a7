import { Link, Outlet } from 'react-router-dom';
import { ROLE_LABELS, roleAtLeast, type Role } from '../../shared/contracts/roles.ts';
import { DocumentTitle } from '../components/ui/document-title.tsx';
import { EmptyState } from '../components/ui/empty-state.tsx';
import { paths } from '../config/paths.ts';
import { roleWithArticle } from '../lib/role-text.ts';
import { useSignedInMe } from '../features/auth/hooks/use-signed-in-me.ts';

/** Shows the child routes only to `minimum` and above. The server enforces the same rule. */
export function RequireRole({ minimum }: { minimum: Role }) {
  const me = useSignedInMe();
  if (roleAtLeast(me.role, minimum)) return <Outlet />;
  return (
    <>
      <DocumentTitle title={`For ${ROLE_LABELS[minimum].toLowerCase()}s`} />
      <EmptyState
        headingLevel={1}
        title={`This page is for ${ROLE_LABELS[minimum].toLowerCase()}s`}
        action={<Link to={paths.overview.getHref()}>Back to the overview</Link>}
      >
        You are {roleWithArticle(me.role)} in {me.department.name}. An admin
        of the department can change your role.
      </EmptyState>
    </>
  );
}
