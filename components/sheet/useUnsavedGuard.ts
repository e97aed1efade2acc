'use client';
/**
 * Keeps unsaved sheet edits from vanishing (issue 23): the browser's own "leave this page?" prompt
 * on reload, close or an address typed, and a confirm before any in-app link (the workspace menu,
 * the breadcrumb, a revision link) navigates away. Ctrl+S / Cmd+S saves instead of opening the
 * browser's "save page as".
 */
import { useEffect, useRef } from 'react';

export const LEAVE_WARNING = 'This sheet has changes that are not saved yet. Leave the page and lose them?';

/** A plain left click on a same-origin link to another page: the ones the App Router turns into a navigation. */
function navigatingLink(event: MouseEvent): HTMLAnchorElement | null {
  if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return null;
  const anchor = (event.target as Element | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
  if (!anchor || anchor.hasAttribute('download') || (anchor.target && anchor.target !== '_self')) return null;
  const to = new URL(anchor.href, window.location.href);
  if (to.origin !== window.location.origin) return null;
  // A link to a place on this same page (only the hash differs) leaves nothing behind.
  if (to.pathname === window.location.pathname && to.search === window.location.search) return null;
  return anchor;
}

export function useUnsavedGuard({ dirty, onSaveShortcut }: { dirty: boolean; onSaveShortcut: (() => void) | null }): void {
  // Read through refs so that the listeners are added once and always see the latest state.
  const dirtyRef = useRef(dirty);
  const saveRef = useRef(onSaveShortcut);
  useEffect(() => {
    dirtyRef.current = dirty;
    saveRef.current = onSaveShortcut;
  });

  useEffect(() => {
    const beforeUnload = (event: BeforeUnloadEvent) => {
      if (!dirtyRef.current) return;
      event.preventDefault();
      // Older Chromium and Safari still need returnValue set to show the prompt.
      event.returnValue = '';
    };
    // Capture phase on the document runs before React's own listeners on the root, so a refused
    // navigation never reaches next/link's click handler.
    const click = (event: MouseEvent) => {
      if (!dirtyRef.current) return;
      if (!navigatingLink(event)) return;
      if (window.confirm(LEAVE_WARNING)) return;
      event.preventDefault();
      event.stopPropagation();
    };
    const keydown = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey) || event.altKey || event.key.toLowerCase() !== 's') return;
      const save = saveRef.current;
      if (!save) return;
      event.preventDefault();
      save();
    };
    window.addEventListener('beforeunload', beforeUnload);
    document.addEventListener('click', click, true);
    window.addEventListener('keydown', keydown);
    return () => {
      window.removeEventListener('beforeunload', beforeUnload);
      document.removeEventListener('click', click, true);
      window.removeEventListener('keydown', keydown);
    };
  }, []);
}
