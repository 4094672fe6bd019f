import type { ReactNode } from 'react';
import { useOutletContext } from 'react-router-dom';
import { can, ROLE_LABELS, type Capability } from '../../shared/roles';
import type { Me } from '../../shared/schemas/auth';
import { PageHeader } from '../components/ui/page-header';

/** The signed-in member, for pages under the signed-in layout (which renders them only once it is known). */
export function useSignedIn(): Me {
  return useOutletContext<Me>();
}

/** Shows the page only to roles with the capability; the server refuses the data to others anyway. */
export function RequireCapability({ capability, title, children }: { capability: Capability; title: string; children: ReactNode }) {
  const me = useSignedIn();
  if (can(me.role, capability)) return <>{children}</>;
  return (
    <>
      <PageHeader title={title} />
      <p className="text-hull-700" data-state="forbidden">
        This page is not open to the role {ROLE_LABELS[me.role].toLowerCase()}. Ask an administrator if you need it.
      </p>
    </>
  );
}
