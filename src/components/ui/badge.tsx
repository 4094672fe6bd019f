import type { ReactNode } from 'react';

const tones = {
  neutral: 'bg-hull-100 text-hull-700',
  accent: 'bg-brass-100 text-brass-800',
  good: 'bg-verdigris-100 text-verdigris-700',
  bad: 'bg-signal-100 text-signal-700',
} as const;

export function Badge({ tone = 'neutral', children }: { tone?: keyof typeof tones; children: ReactNode }) {
  return <span className={`inline-block rounded-full px-2 py-0.5 text-caption font-semibold ${tones[tone]}`}>{children}</span>;
}
