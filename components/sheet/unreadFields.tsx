'use client';
import { createContext, useCallback, useContext, useMemo, useState } from 'react';

/**
 * Fields whose text the number parser refused (lib/units/parse): the form still holds the last
 * value it could read, so the result on the strip is not the result of what is on the screen.
 * The sheet reads this to mark its result as not current and to refuse saving (issue 22).
 */
interface UnreadFields {
  /** field key → the parser's message; empty when every field reads. */
  problems: Readonly<Record<string, string>>;
  report: (fieldKey: string, message: string | null) => void;
}

export const UnreadFieldsContext = createContext<UnreadFields>({ problems: {}, report: () => {} });

/** The state behind the context: the sheet owns it (it reads `problems`) and provides it to its fields. */
export function useUnreadFieldsState(): UnreadFields {
  const [problems, setProblems] = useState<Record<string, string>>({});
  const report = useCallback((fieldKey: string, message: string | null) => {
    setProblems((current) => {
      if ((current[fieldKey] ?? null) === message) return current;
      const next = { ...current };
      if (message === null) delete next[fieldKey];
      else next[fieldKey] = message;
      return next;
    });
  }, []);
  return useMemo(() => ({ problems, report }), [problems, report]);
}

export function useUnreadFields(): UnreadFields {
  return useContext(UnreadFieldsContext);
}
