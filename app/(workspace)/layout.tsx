import type { ReactNode } from 'react';
import { WorkspaceNav } from '@/components/shell/WorkspaceNav';
import { QueryProvider } from '@/components/providers/QueryProvider';
import { UserMenu } from '@/components/auth/UserMenu';
import { NumberFormatProvider } from '@/components/providers/NumberFormatProvider';
import { setDecimalSeparatorAction, setUnitSystemAction } from '@/server/auth/preferenceActions';
import { requirePageUser } from '@/server/auth/session';

export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  // Each page checks again for its own data: a layout is not re-run on every client navigation.
  const user = await requirePageUser();
  return (
    <div className="min-h-screen">
      <WorkspaceNav isAdmin={user.role === 'admin'} userSlot={<UserMenu name={user.name} teamName={user.teamName} role={user.role} unitSystem={user.unitSystem} onUnitSystemChange={setUnitSystemAction} decimalSeparator={user.decimalSeparator} onDecimalSeparatorChange={setDecimalSeparatorAction} />} />
      <main className="mx-auto max-w-sheet px-4 py-6">
        <QueryProvider>
          <NumberFormatProvider chosen={user.decimalSeparator} currency={user.teamCurrency}>
            {children}
          </NumberFormatProvider>
        </QueryProvider>
      </main>
    </div>
  );
}
