'use client';
import { createContext, useContext, useEffect, useState, type ReactNode } from 'react';
import { decimalSeparatorOfLocale, type DecimalSeparator } from '@/lib/units/parse';

interface NumberFormat {
  /** The separator every field reads with (lib/units/parse). */
  decimalSeparator: DecimalSeparator;
  /** What the user chose; null when the browser's locale decides. */
  chosen: DecimalSeparator | null;
  /** ISO 4217 code of the team's money. */
  currency: string;
}

const NumberFormatContext = createContext<NumberFormat>({ decimalSeparator: '.', chosen: null, currency: 'EUR' });

/**
 * The user's decimal separator and the team's currency for every client component of the workspace.
 * When the user never chose a separator, the browser's locale decides (Intl.NumberFormat); the
 * server cannot know it, so the first render reads '.' and the effect corrects it after hydration.
 */
export function NumberFormatProvider({ chosen, currency, children }: { chosen: DecimalSeparator | null; currency: string; children: ReactNode }) {
  const [fromLocale, setFromLocale] = useState<DecimalSeparator>('.');
  useEffect(() => {
    setFromLocale(decimalSeparatorOfLocale(typeof navigator === 'undefined' ? undefined : navigator.languages));
  }, []);
  return <NumberFormatContext.Provider value={{ decimalSeparator: chosen ?? fromLocale, chosen, currency }}>{children}</NumberFormatContext.Provider>;
}

export function useNumberFormat(): NumberFormat {
  return useContext(NumberFormatContext);
}

export function useDecimalSeparator(): DecimalSeparator {
  return useContext(NumberFormatContext).decimalSeparator;
}
