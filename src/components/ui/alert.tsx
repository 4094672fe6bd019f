import type { ReactNode } from 'react';

const tones = {
  error: 'border-signal-500 bg-signal-50 text-signal-700',
  success: 'border-verdigris-500 bg-verdigris-50 text-verdigris-700',
  info: 'border-hull-300 bg-hull-50 text-hull-800',
} as const;

/** A boxed message inside a page or form, e.g. a failed sign-in or a saved change. */
export function Alert({ tone = 'info', children }: { tone?: keyof typeof tones; children: ReactNode }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} data-alert={tone} className={`rounded-plate border-l-4 px-4 py-3 text-small ${tones[tone]}`}>
      {children}
    </div>
  );
}
