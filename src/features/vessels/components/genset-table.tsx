import type { Genset, VesselDetail } from '../../../../shared/schemas/vessels';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatHours, formatKva, formatKw, formatPct, formatSfoc } from '../../../lib/format';

interface GensetTableProps {
  vessel: VesselDetail;
  /** Shows the edit and remove buttons (the server enforces the same rule). */
  canEdit: boolean;
  onEdit: (genset: Genset) => void;
  onRemove: (genset: Genset) => void;
  removingId?: string;
}

const SFOC_LABELS = [
  ['p25', 25],
  ['p50', 50],
  ['p75', 75],
  ['p85', 85],
  ['p100', 100],
] as const;

function ShopTestSfoc({ sfoc }: { sfoc: Genset['shopTestSfoc'] }) {
  const points = SFOC_LABELS.filter(([key]) => sfoc[key] !== null);
  if (points.length === 0) return <span className="text-hull-400">not entered</span>;
  return (
    <dl className="grid grid-cols-[auto_auto] justify-end gap-x-2">
      {points.map(([key, pct]) => (
        <div key={key} className="contents">
          <dt className="text-hull-500">{pct} %</dt>
          <dd>{formatSfoc(sfoc[key])}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The genset register of one vessel. */
export function GensetTable({ vessel, canEdit, onEdit, onRemove, removingId }: GensetTableProps) {
  const sectionName = new Map(vessel.busSections.map((s) => [s.id, s.name]));
  return (
    <Table caption={`Genset register of ${vessel.name}`}>
      <thead>
        <tr>
          <Th>Set</Th>
          <Th>Bus section</Th>
          <Th numeric>Rated</Th>
          <Th numeric>Load range</Th>
          <Th numeric>Shop-test SFOC</Th>
          <Th>Duty</Th>
          <Th numeric>Running hours</Th>
          {canEdit ? <Th className="text-right">Actions</Th> : null}
        </tr>
      </thead>
      <tbody>
        {vessel.gensets.map((g) => (
          <tr key={g.id} data-genset={g.designation}>
            <Td className="font-semibold text-hull-900">{g.designation}</Td>
            <Td>{g.busSectionId ? (sectionName.get(g.busSectionId) ?? '–') : <span className="text-hull-500">emergency switchboard</span>}</Td>
            <Td numeric>
              {formatKw(g.ratedKw)}
              <br />
              <span className="text-hull-500">{formatKva(g.ratedKva)}</span>
            </Td>
            <Td numeric>
              {formatPct(g.minLoadPct)} to {formatPct(g.maxLoadPct)}
            </Td>
            <Td numeric>
              <ShopTestSfoc sfoc={g.shopTestSfoc} />
            </Td>
            <Td>{g.duty === 'emergency' ? <Badge tone="accent">Emergency</Badge> : <Badge>Service</Badge>}</Td>
            <Td numeric>{g.latestRunningHours === null ? <span className="text-hull-400">no log yet</span> : formatHours(g.latestRunningHours)}</Td>
            {canEdit ? (
              <Td className="whitespace-nowrap text-right">
                <Button variant="secondary" size="sm" onClick={() => onEdit(g)} aria-label={`Edit ${g.designation}`}>
                  Edit
                </Button>{' '}
                <Button
                  variant="quiet"
                  size="sm"
                  onClick={() => onRemove(g)}
                  pending={removingId === g.id}
                  pendingLabel="Removing…"
                  aria-label={`Remove ${g.designation}`}
                >
                  Remove
                </Button>
              </Td>
            ) : null}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
