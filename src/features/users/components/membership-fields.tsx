import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { ROLE_LABELS, ROLES, VESSEL_SCOPED_ROLES, type Role } from '../../../../shared/roles';

export interface VesselOption {
  id: string;
  name: string;
}

interface VesselPickerProps {
  id: string;
  vessels: VesselOption[];
  value: string[];
  onChange: (vesselIds: string[]) => void;
  error?: string;
  legend?: string;
}

/** Checkboxes for the vessels a chief engineer acts on. */
export function VesselPicker({ id, vessels, value, onChange, error, legend = 'Vessels' }: VesselPickerProps) {
  const toggle = (vesselId: string, checked: boolean) =>
    onChange(checked ? [...value.filter((v) => v !== vesselId), vesselId] : value.filter((v) => v !== vesselId));
  return (
    <fieldset id={id} aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 text-small font-semibold text-hull-800">{legend}</legend>
      {vessels.length === 0 ? (
        <p className="text-small text-hull-500">The company has no vessels yet; add one on the fleet page first.</p>
      ) : (
        <div className="flex flex-wrap gap-x-4 gap-y-1">
          {vessels.map((v) => (
            <label key={v.id} className="inline-flex items-center gap-2 text-body">
              <input type="checkbox" className="h-4 w-4 accent-brass-500" checked={value.includes(v.id)} onChange={(e) => toggle(v.id, e.target.checked)} />
              {v.name}
            </label>
          ))}
        </div>
      )}
      {error ? (
        <p id={`${id}-error`} role="alert" className="mt-1 text-caption font-semibold text-signal-600">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

interface VesselScopeFieldProps<T extends FieldValues> {
  control: Control<T>;
  /** The form field holding the vessel ids. */
  name: Path<T>;
  /** The role chosen in the form: the picker shows only for roles whose membership names its vessels. */
  role: Role;
  id: string;
  vessels: VesselOption[];
  legend?: string;
}

/** The vessel picker bound to a react-hook-form field, shown only for vessel-scoped roles. */
export function VesselScopeField<T extends FieldValues>({ control, name, role, id, vessels, legend }: VesselScopeFieldProps<T>) {
  if (!VESSEL_SCOPED_ROLES.includes(role)) return null;
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <VesselPicker id={id} legend={legend} vessels={vessels} value={(field.value as string[] | undefined) ?? []} onChange={field.onChange} error={fieldState.error?.message} />
      )}
    />
  );
}

/** Sends vessel ids only with a vessel-scoped role; other roles cover the whole fleet. */
export function withVesselScope<T extends { role: Role; vesselIds: string[] }>(input: T): T {
  return { ...input, vesselIds: VESSEL_SCOPED_ROLES.includes(input.role) ? input.vesselIds : [] };
}

/** The <option>s of a role select, one per role, with its label. */
export function RoleOptions() {
  return (
    <>
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {ROLE_LABELS[r]}
        </option>
      ))}
    </>
  );
}
