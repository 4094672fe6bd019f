import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { EmptyState, QueryView } from '../../components/ui/states';
import { useAudit } from '../../features/audit/api/get-audit';
import { AuditTable } from '../../features/audit/components/audit-table';
import { RequireCapability } from '../signed-in';

function AuditPage() {
  const audit = useAudit();
  return (
    <>
      <PageHeader title="Audit trail" description="Every change to vessels, sets, members and settings, with the record before and after." />
      <QueryView
        query={audit}
        loadingLabel="Loading the audit trail…"
        isEmpty={(list) => list.length === 0}
        empty={<EmptyState title="Nothing recorded yet" next="Changes appear here as soon as someone edits a vessel, a set, a member or the settings." />}
      >
        {(list) => (
          <Panel>
            <AuditTable entries={list} />
          </Panel>
        )}
      </QueryView>
    </>
  );
}

export function Component() {
  return (
    <RequireCapability capability="audit:read" title="Audit trail">
      <AuditPage />
    </RequireCapability>
  );
}
