'use client';

import { useEffect, useRef } from 'react';

export interface Shortcut {
  keys: string;
  action: string;
}

/** The help sheet listing an editor's keyboard shortcuts; opened with `?`, closed with Escape. */
export function ShortcutHelp({ open, onClose, shortcuts, title }: { open: boolean; onClose: () => void; shortcuts: readonly Shortcut[]; title: string }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="shortcut-help-title"
      className="m-auto w-full max-w-md border-[0.5px] border-rule bg-paper-raised p-6 text-graphite backdrop:bg-graphite/30"
      data-testid="shortcut-help"
    >
      <h2 id="shortcut-help-title" className="text-lg font-semibold">
        {title}
      </h2>
      <table className="mt-4 w-full text-sm">
        <tbody>
          {shortcuts.map((s) => (
            <tr key={s.keys} className="border-b-[0.5px] border-rule">
              <td className="py-2 pr-4">
                <kbd className="tabular rounded-[2px] border-[0.5px] border-rule-strong bg-paper px-1.5 py-0.5 text-xs">{s.keys}</kbd>
              </td>
              <td className="py-2">{s.action}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" onClick={onClose} className="mt-4 text-sm text-accent underline underline-offset-2">
        Close
      </button>
    </dialog>
  );
}
