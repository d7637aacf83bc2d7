import type { ReactNode } from 'react';
import { Wordmark } from '../../../components/brand/wordmark';

/** The frame of the screens a person sees before signing in. */
export function AuthCard({
  title,
  intro,
  children,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center bg-ink-100 px-4 py-10">
      <main id="main" className="w-full max-w-sm">
        <div className="mb-6 flex justify-center">
          <Wordmark />
        </div>
        <div className="rounded-lg border border-ink-200 bg-white px-6 py-6 shadow-sm">
          <h1 className="text-lg font-semibold text-ink-900">{title}</h1>
          {intro && <div className="mt-1 text-sm text-ink-600">{intro}</div>}
          <div className="mt-5">{children}</div>
        </div>
      </main>
    </div>
  );
}
