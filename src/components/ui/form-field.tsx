import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';

interface FieldProps {
  label: string;
  /** id of the control inside; also used to tie the error text to it. */
  htmlFor: string;
  error?: string;
  hint?: string;
  className?: string;
  children: ReactNode;
}

/** A labelled control with its error message right beside it (under it on narrow screens). */
export function Field({ label, htmlFor, error, hint, className = '', children }: FieldProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={htmlFor} className="text-small font-semibold text-hull-800">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${htmlFor}-hint`} className="text-caption text-hull-500">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${htmlFor}-error`} role="alert" data-field-error={htmlFor} className="text-caption font-semibold text-signal-600">
          {error}
        </p>
      ) : null}
    </div>
  );
}

const controlClass =
  'w-full rounded-plate border bg-white px-3 py-2 text-body text-hull-900 placeholder:text-hull-400 disabled:bg-deck-100 aria-[invalid=true]:border-signal-500';

type InputProps = InputHTMLAttributes<HTMLInputElement> & { invalid?: boolean; unit?: string };

/** Text or number input; `unit` prints the unit at the right edge so typed numbers always carry it. */
export function Input({ invalid, unit, className = '', id, ...rest }: InputProps) {
  const input = (
    <input
      id={id}
      aria-invalid={invalid || undefined}
      aria-describedby={invalid && id ? `${id}-error` : undefined}
      className={`${controlClass} border-hull-200 ${unit ? 'pr-14' : ''} ${className}`}
      {...rest}
    />
  );
  if (!unit) return input;
  return (
    <div className="relative">
      {input}
      <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-small text-hull-500">{unit}</span>
    </div>
  );
}

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { invalid?: boolean };

export function Select({ invalid, className = '', id, children, ...rest }: SelectProps) {
  return (
    <select
      id={id}
      aria-invalid={invalid || undefined}
      aria-describedby={invalid && id ? `${id}-error` : undefined}
      className={`${controlClass} border-hull-200 ${className}`}
      {...rest}
    >
      {children}
    </select>
  );
}
