'use client';

import { useState, type KeyboardEvent } from 'react';
import { useEditor } from './editor-context';
import { PathPanel } from '../panels/path-panel';
import { LookPanel } from '../panels/look-panel';
import { SkyPanel } from '../panels/sky-panel';
import { PhysicsPanel } from '../panels/physics-panel';
import { NotesPanel } from '../panels/notes-panel';

const TABS = [
  { id: 'path', label: 'Path', Panel: PathPanel, prefixes: ['path'] },
  { id: 'look', label: 'Look', Panel: LookPanel, prefixes: ['look', 'projection'] },
  { id: 'sky', label: 'Sky', Panel: SkyPanel, prefixes: ['sky', 'effects', 'exposure'] },
  { id: 'physics', label: 'Physics', Panel: PhysicsPanel, prefixes: ['massSolar'] },
  { id: 'notes', label: 'Notes', Panel: NotesPanel, prefixes: ['notes'] },
] as const;

/** The five editor panels of product.md as tabs; a tab with a problem in it carries a mark. */
export function EditorTabs() {
  const { canEdit, issues } = useEditor();
  const [active, setActive] = useState<(typeof TABS)[number]['id']>('path');
  const hasIssue = (prefixes: readonly string[]) => Object.keys(issues).some((k) => prefixes.some((p) => k === p || k.startsWith(`${p}.`)));
  const onKey = (e: KeyboardEvent) => {
    const i = TABS.findIndex((t) => t.id === active);
    const next = e.key === 'ArrowRight' ? (i + 1) % TABS.length : e.key === 'ArrowLeft' ? (i + TABS.length - 1) % TABS.length : -1;
    if (next >= 0) {
      e.preventDefault();
      setActive(TABS[next].id);
      document.getElementById(`tab-${TABS[next].id}`)?.focus();
    }
  };
  const current = TABS.find((t) => t.id === active)!;
  return (
    <section className="rounded-lg border border-ink-700 bg-ink-800/80 p-4" aria-label="Scene panels">
      <div role="tablist" aria-label="Scene panels" className="mb-4 flex gap-1 border-b border-ink-700" onKeyDown={onKey}>
        {TABS.map((t) => (
          <button
            key={t.id}
            id={`tab-${t.id}`}
            role="tab"
            type="button"
            aria-selected={active === t.id}
            aria-controls={`panel-${t.id}`}
            tabIndex={active === t.id ? 0 : -1}
            data-testid={`tab-${t.id}`}
            onClick={() => setActive(t.id)}
            className={`-mb-px border-b-2 px-3 py-2 text-sm ${active === t.id ? 'border-teal-400 text-teal-300' : 'border-transparent text-slate-400 hover:text-slate-200'}`}
          >
            {t.label}
            {hasIssue(t.prefixes) ? <span className="ml-1 text-danger-400" aria-label="has a problem">•</span> : null}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`panel-${current.id}`} aria-labelledby={`tab-${current.id}`}>
        <fieldset disabled={!canEdit} className="min-w-0">
          <current.Panel />
        </fieldset>
      </div>
    </section>
  );
}
