'use client';

import Link from 'next/link';
import { useState, useTransition } from 'react';
import { SignOutButton } from './SignOutButton';

type UnitSystemChoice = 'si' | 'imperial';
type SeparatorChoice = '.' | ',' | 'browser';

const SEPARATOR_CHOICES: ReadonlyArray<{ value: SeparatorChoice; label: string; title: string }> = [
  { value: 'browser', label: 'Browser', title: "Your browser's language decides" },
  { value: '.', label: '1.5', title: 'A point: 1.5' },
  { value: ',', label: '1,5', title: 'A comma: 1,5' },
];

/**
 * Who is signed in, in which team and role; the units switch; sign out. The switch stores the
 * choice through `onUnitSystemChange`, the server action the workspace layout passes in
 * (server/auth/preferenceActions): components do not import server code (DEVELOPERS.md, layers).
 * The admin links (members, API tokens) and the API guide live here, so that every page reaches
 * them; the layout says which the user may open.
 */
export function UserMenu({
  name,
  teamName,
  role,
  unitSystem,
  onUnitSystemChange,
  canManageMembers = false,
  canManageTokens = false,
  decimalSeparator,
  onDecimalSeparatorChange,
}: {
  name: string;
  teamName: string;
  role: string;
  unitSystem: UnitSystemChoice;
  onUnitSystemChange: (unitSystem: UnitSystemChoice) => Promise<unknown>;
  canManageMembers?: boolean;
  canManageTokens?: boolean;
  /** The stored choice; null when the browser's locale decides. */
  decimalSeparator: '.' | ',' | null;
  onDecimalSeparatorChange: (choice: SeparatorChoice) => Promise<unknown>;
}) {
  const [units, setUnits] = useState(unitSystem);
  const [separator, setSeparator] = useState<SeparatorChoice>(decimalSeparator ?? 'browser');
  const [pending, startTransition] = useTransition();
  const [open, setOpen] = useState(false);

  return (
    <div className="relative">
      <button type="button" aria-expanded={open} aria-controls="user-menu" onClick={() => setOpen((v) => !v)} className="flex items-center gap-2 rounded px-2 py-1 text-ink-100 hover:bg-ink-800">
        <span className="font-medium text-white">{name}</span>
        <span className="text-caption text-ink-300">{role}</span>
        <span aria-hidden="true">▾</span>
      </button>
      {open ? (
        <div id="user-menu" className="absolute right-0 z-20 mt-2 w-64 rounded-md border border-ink-100 bg-white p-3 text-ink-900 shadow-lg">
          <p className="text-caption text-ink-500">Team</p>
          <p className="font-medium">{teamName}</p>
          <fieldset className="mt-3">
            <legend className="field-label">Units</legend>
            <div className="mt-1 flex gap-1" role="radiogroup">
              {(['si', 'imperial'] as const).map((choice) => (
                <label key={choice} className={`flex-1 cursor-pointer rounded-md border px-2 py-1 text-center ${units === choice ? 'border-copper-500 bg-copper-300/20 font-medium' : 'border-ink-200'}`}>
                  <input
                    type="radio"
                    name="unit-system"
                    value={choice}
                    checked={units === choice}
                    disabled={pending}
                    className="sr-only"
                    onChange={() => {
                      setUnits(choice);
                      startTransition(async () => {
                        try {
                          await onUnitSystemChange(choice);
                        } catch {
                          setUnits(unitSystem);
                        }
                      });
                    }}
                  />
                  {choice === 'si' ? 'SI' : 'Imperial'}
                </label>
              ))}
            </div>
          </fieldset>
          <fieldset className="mt-3">
            <legend className="field-label">Decimal separator</legend>
            <div className="mt-1 flex gap-1" role="radiogroup">
              {SEPARATOR_CHOICES.map((choice) => (
                <label key={choice.value} title={choice.title} className={`flex-1 cursor-pointer rounded-md border px-2 py-1 text-center ${separator === choice.value ? 'border-copper-500 bg-copper-300/20 font-medium' : 'border-ink-200'}`}>
                  <input
                    type="radio"
                    name="decimal-separator"
                    value={choice.value}
                    aria-label={choice.title}
                    checked={separator === choice.value}
                    disabled={pending}
                    className="sr-only"
                    onChange={() => {
                      setSeparator(choice.value);
                      startTransition(async () => {
                        try {
                          await onDecimalSeparatorChange(choice.value);
                        } catch {
                          setSeparator(decimalSeparator ?? 'browser');
                        }
                      });
                    }}
                  />
                  {choice.label}
                </label>
              ))}
            </div>
          </fieldset>
          <nav aria-label={canManageMembers || canManageTokens ? 'Administration' : 'Help'} className="mt-3 border-t border-ink-100 pt-2">
            {canManageMembers || canManageTokens ? <p className="text-caption text-ink-500">Administration</p> : null}
            <ul className="mt-1 grid gap-0.5">
              {canManageMembers ? (
                <li>
                  <Link href="/admin/members" className="block rounded px-2 py-1 hover:bg-ink-50" onClick={() => setOpen(false)}>
                    Members
                  </Link>
                </li>
              ) : null}
              {canManageTokens ? (
                <li>
                  <Link href="/admin/tokens" className="block rounded px-2 py-1 hover:bg-ink-50" onClick={() => setOpen(false)}>
                    API tokens
                  </Link>
                </li>
              ) : null}
              <li>
                <Link href="/api-docs" className="block rounded px-2 py-1 hover:bg-ink-50" onClick={() => setOpen(false)}>
                  API guide
                </Link>
              </li>
            </ul>
          </nav>
          <a href="/profile" className="btn-quiet mt-3 w-full justify-center" data-testid="profile-link">
            Profile and licence
          </a>
          <SignOutButton className="btn-quiet mt-1 w-full justify-center" />
        </div>
      ) : null}
    </div>
  );
}
