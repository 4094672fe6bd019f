import type { FuelPriceRow } from '../../../../shared/schemas/savings';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorState, QueryView } from '../../../components/ui/states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate } from '../../../lib/format';
import { useDeleteFuelPrice } from '../api/delete-fuel-price';
import { useFuelPrices } from '../api/get-fuel-prices';

const perTonne = (v: number, currency: string) => `${v.toLocaleString('en-GB', { maximumFractionDigits: 2 })}\u00a0${currency}/t`;

function Rows({ rows, mayEdit }: { rows: FuelPriceRow[]; mayEdit: boolean }) {
  const remove = useDeleteFuelPrice();
  const sorted = [...rows].sort((a, b) => a.grade.localeCompare(b.grade) || b.validFrom.localeCompare(a.validFrom));
  return (
    <>
      {remove.isError ? <ErrorState error={remove.error} title="The price could not be removed" /> : null}
      <Table caption="Fuel prices per grade and validity">
        <thead>
          <tr>
            <Th>Grade</Th>
            <Th>Valid from</Th>
            <Th>Valid to</Th>
            <Th numeric>Price per tonne</Th>
            {mayEdit ? (
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {sorted.map((p) => (
            <tr key={p.id} data-price={`${p.grade}-${p.validFrom}`}>
              <Td>{p.grade}</Td>
              <Td>{formatDate(p.validFrom)}</Td>
              <Td>{p.validTo ? formatDate(p.validTo) : 'until a newer price'}</Td>
              <Td numeric>{perTonne(p.pricePerT, p.currency)}</Td>
              {mayEdit ? (
                <Td>
                  <Button
                    size="sm"
                    variant="secondary"
                    pending={remove.isPending && remove.variables === p.id}
                    pendingLabel="Removing…"
                    onClick={() => window.confirm(`Remove the ${p.grade} price valid from ${formatDate(p.validFrom)}?`) && remove.mutate(p.id)}
                  >
                    Remove
                  </Button>
                </Td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </Table>
    </>
  );
}

/** The company's fuel prices; administrators may remove one. */
export function FuelPriceTable({ mayEdit }: { mayEdit: boolean }) {
  const prices = useFuelPrices();
  return (
    <QueryView
      query={prices}
      loadingLabel="Loading fuel prices…"
      isEmpty={(rows) => rows.length === 0}
      empty={<EmptyState title="No fuel prices yet" next={mayEdit ? 'Set the price per tonne of each grade burned; savings and reports are then costed with it.' : 'An administrator sets the prices; until then savings are shown in tonnes only.'} />}
    >
      {(rows) => <Rows rows={rows} mayEdit={mayEdit} />}
    </QueryView>
  );
}
