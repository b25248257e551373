'use client';

import { useCallback, useEffect, useState } from 'react';

/** Where an unsaved edit is kept: per person, scene and the revision it started from. */
export function draftKey(userId: string, sceneId: string, basedOn: number): string {
  return `skywell:scene-draft:${userId}:${sceneId}:r${basedOn}`;
}

export interface StoredDraft<T> {
  savedAt: string;
  values: T;
}

function read<T>(key: string): StoredDraft<T> | null {
  try {
    const raw = window.localStorage.getItem(key);
    return raw ? (JSON.parse(raw) as StoredDraft<T>) : null;
  } catch {
    return null;
  }
}

/**
 * Autosaves the form to localStorage while it differs from the loaded
 * revision, offers a kept draft back on the next visit, and warns before the
 * page is left with changes nobody saved.
 */
export function useDraft<T>(key: string, values: T, dirty: boolean, enabled: boolean) {
  const [offered, setOffered] = useState<StoredDraft<T> | null>(null);
  const [lastSavedAt, setLastSavedAt] = useState<string | null>(null);
  const [checked, setChecked] = useState(false);

  useEffect(() => {
    if (!enabled) return;
    setOffered(read<T>(key));
    setChecked(true);
  }, [key, enabled]);

  useEffect(() => {
    // Wait until the producer has answered the "restore draft" prompt, so an old draft is never overwritten unseen.
    if (!enabled || !checked || offered) return;
    const timer = setTimeout(() => {
      try {
        if (dirty) {
          const savedAt = new Date().toISOString();
          window.localStorage.setItem(key, JSON.stringify({ savedAt, values }));
          setLastSavedAt(savedAt);
        } else {
          window.localStorage.removeItem(key);
          setLastSavedAt(null);
        }
      } catch {
        // Storage full or blocked: the leave warning still protects the edit.
      }
    }, 600);
    return () => clearTimeout(timer);
  }, [key, values, dirty, enabled, checked, offered]);

  useEffect(() => {
    if (!enabled || !dirty) return;
    const warn = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      event.returnValue = '';
    };
    // In-app links do not fire beforeunload: ask before following them too.
    const onClick = (event: MouseEvent) => {
      const anchor = (event.target as HTMLElement | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
      if (!anchor || anchor.target === '_blank' || event.defaultPrevented) return;
      if (!window.confirm('This scene has changes that are not saved as a revision. They are kept as a draft in this browser. Leave anyway?')) {
        event.preventDefault();
        event.stopPropagation();
      }
    };
    window.addEventListener('beforeunload', warn);
    document.addEventListener('click', onClick, true);
    return () => {
      window.removeEventListener('beforeunload', warn);
      document.removeEventListener('click', onClick, true);
    };
  }, [enabled, dirty]);

  const discard = useCallback(() => {
    try {
      window.localStorage.removeItem(key);
    } catch {
      // nothing to remove
    }
    setOffered(null);
  }, [key]);
  const accept = useCallback(() => setOffered(null), []);
  const clear = useCallback(() => {
    try {
      window.localStorage.removeItem(key);
    } catch {
      // nothing to remove
    }
    setLastSavedAt(null);
  }, [key]);

  return { offered, accept, discard, clear, lastSavedAt };
}
