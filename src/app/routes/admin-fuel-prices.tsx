import { can } from '../../../shared/roles';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { FuelPriceForm } from '../../features/fuel-prices/components/fuel-price-form';
import { FuelPriceTable } from '../../features/fuel-prices/components/fuel-price-table';
import { useSignedIn } from '../signed-in';

/** Fuel prices per grade and valid-from date: administrators edit them, every member reads them. */
export function Component() {
  const me = useSignedIn();
  const mayEdit = can(me.role, 'company:settings');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Fuel prices" description={`Price per tonne of each grade in the company currency (${me.company.currency}); each holds from its date until the next price of the grade.`} />
      {mayEdit ? (
        <Panel title="Set a price">
          <FuelPriceForm currency={me.company.currency} today={new Date().toISOString().slice(0, 10)} />
        </Panel>
      ) : null}
      <Panel title="Prices">
        <FuelPriceTable mayEdit={mayEdit} />
      </Panel>
    </div>
  );
}
