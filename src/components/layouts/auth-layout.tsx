import type { ReactNode } from 'react';
import { Wordmark } from '../ui/logo-mark';

/** The frame of the pages before sign-in: mark, one heading, one form. */
export function AuthLayout({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-hull-900 px-4 py-bay">
      <div className="mb-6">
        <Wordmark tone="light" />
      </div>
      <main className="w-full max-w-form rounded-plate border-t-4 border-brass-400 bg-white px-bay py-8 shadow-plate">
        <h1 className="mb-6 text-title">{title}</h1>
        {children}
      </main>
      <p className="mt-6 max-w-form text-center text-caption text-hull-300">Daily genset logs, fuel curves and load-sharing advice for the engine department.</p>
    </div>
  );
}
