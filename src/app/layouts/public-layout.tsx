import { Outlet } from 'react-router-dom';
import { Logo } from '@/components/logo';

/** Pages for people who are not signed in: one narrow column on a quiet page. */
export function Component() {
  return (
    <div className="flex min-h-screen flex-col items-center bg-paper-sunken px-4 pt-20 pb-10">
      <div className="mb-6 flex items-center gap-2 text-ink">
        <Logo className="text-ink" />
        <span className="text-title font-semibold tracking-tight">Phasewright</span>
      </div>
      <main className="w-full max-w-form rounded-card border border-rule bg-paper-raised p-6 shadow-card">
        <Outlet />
      </main>
      <p className="mt-6 max-w-form text-center text-caption text-ink-muted">
        Work-up and isolation routes for process development.
      </p>
    </div>
  );
}
