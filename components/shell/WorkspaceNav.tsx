'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { Wordmark } from './Wordmark';

export const WORKSPACE_SECTIONS = [
  { href: '/projects', label: 'Projects' },
  { href: '/catalogue', label: 'Catalogue' },
  { href: '/verification', label: 'Verification' },
  { href: '/admin/members', label: 'Admin', adminOnly: true },
] as const;

export function WorkspaceNav({ userSlot, isAdmin = false }: { userSlot?: React.ReactNode; isAdmin?: boolean }) {
  const pathname = usePathname();
  // Only admins can use the admin pages (they answer 403 to others): do not offer them.
  const sections = WORKSPACE_SECTIONS.filter((section) => isAdmin || !('adminOnly' in section && section.adminOnly));
  return (
    <header className="bg-ink-900 text-paper">
      <nav aria-label="Workspace" className="mx-auto flex h-12 max-w-sheet items-center gap-6 px-4">
        <Link href="/projects" aria-label="Ampwarden home">
          <Wordmark />
        </Link>
        <ul className="flex items-center gap-1">
          {sections.map((section) => {
            const active = pathname === section.href || pathname.startsWith(`${section.href}/`);
            return (
              <li key={section.href}>
                <Link
                  href={section.href}
                  aria-current={active ? 'page' : undefined}
                  className={`rounded px-3 py-1.5 text-body ${active ? 'bg-ink-700 text-white' : 'text-ink-200 hover:bg-ink-800 hover:text-white'}`}
                >
                  {section.label}
                </Link>
              </li>
            );
          })}
        </ul>
        <div className="ml-auto flex items-center gap-3 text-body text-ink-200">{userSlot}</div>
      </nav>
    </header>
  );
}
