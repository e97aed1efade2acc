import type { ReactNode } from 'react';
import { WorkspaceNav } from '@/components/shell/WorkspaceNav';
import { QueryProvider } from '@/components/providers/QueryProvider';

export default function WorkspaceLayout({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-screen">
      <WorkspaceNav />
      <main className="mx-auto max-w-sheet px-4 py-6">
        <QueryProvider>{children}</QueryProvider>
      </main>
    </div>
  );
}
