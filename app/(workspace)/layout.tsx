import type { ReactNode } from 'react';
import { WorkspaceNav } from '@/components/shell/WorkspaceNav';
import { QueryProvider } from '@/components/providers/QueryProvider';
import { UserMenu } from '@/components/auth/UserMenu';
import { NumberFormatProvider } from '@/components/providers/NumberFormatProvider';
import { setDecimalSeparatorAction, setUnitSystemAction } from '@/server/auth/preferenceActions';
import { requirePageUser } from '@/server/auth/session';
import { can } from '@/lib/auth/permissions';
import { NotificationBell } from '@/components/shell/NotificationBell';
import { unreadNotificationCount } from '@/db/queries/notifications';

export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  // Each page checks again for its own data: a layout is not re-run on every client navigation.
  const user = await requirePageUser();
  const unread = await unreadNotificationCount(user.teamId, user.id);
  return (
    <div className="min-h-screen">
      <WorkspaceNav
        isAdmin={user.role === 'admin'}
        userSlot={
          <>
            <NotificationBell unread={unread} />
            <UserMenu
            name={user.name}
            teamName={user.teamName}
            role={user.role}
            unitSystem={user.unitSystem}
            onUnitSystemChange={setUnitSystemAction}
            canManageMembers={can(user.role, 'members:manage')}
            canManageTokens={can(user.role, 'apitoken:manage')}
            decimalSeparator={user.decimalSeparator}
            onDecimalSeparatorChange={setDecimalSeparatorAction}
            />
          </>
        }
      />
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
