import { useQueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { QueryView } from '../../components/ui/states';
import { meQueryOptions } from '../../features/auth/api/get-me';
import { useCompany } from '../../features/company/api/get-company';
import { CompanySettingsForm } from '../../features/company/components/company-settings-form';
import { RequireCapability } from '../signed-in';

function SettingsPage() {
  const company = useCompany();
  const queryClient = useQueryClient();
  return (
    <>
      <PageHeader title="Company settings" description="Name and currency used across Kilowatch." />
      <Panel>
        <QueryView query={company} loadingLabel="Loading settings…">
          {/* The company name also shows in the console bar, which reads it from the session. */}
          {(settings) => <CompanySettingsForm settings={settings} onSaved={() => void queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey })} />}
        </QueryView>
      </Panel>
    </>
  );
}

export function Component() {
  return (
    <RequireCapability capability="company:settings" title="Company settings">
      <SettingsPage />
    </RequireCapability>
  );
}
