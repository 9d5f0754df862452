'use client';

import { useCallback, useRef, useState } from 'react';

/** Edits of the same field within this window count as one step of undo (a slider drag is one step). */
const COALESCE_MS = 700;
const MAX_STEPS = 200;

interface History<T> {
  past: T[];
  present: T;
  future: T[];
}

/** Undo/redo over immutable values. `set(value, key)` merges quick successive edits that share `key`. */
export function useUndoHistory<T>(initial: T) {
  const [h, setH] = useState<History<T>>({ past: [], present: initial, future: [] });
  const last = useRef<{ key: string | undefined; at: number }>({ key: undefined, at: 0 });

  const set = useCallback((value: T, key?: string) => {
    const now = Date.now();
    const merge = key !== undefined && key === last.current.key && now - last.current.at < COALESCE_MS;
    last.current = { key, at: now };
    setH((prev) =>
      merge ? { ...prev, present: value, future: [] } : { past: [...prev.past, prev.present].slice(-MAX_STEPS), present: value, future: [] },
    );
  }, []);
  const undo = useCallback(() => {
    last.current = { key: undefined, at: 0 };
    setH((prev) => (prev.past.length === 0 ? prev : { past: prev.past.slice(0, -1), present: prev.past.at(-1)!, future: [prev.present, ...prev.future] }));
  }, []);
  const redo = useCallback(() => {
    last.current = { key: undefined, at: 0 };
    setH((prev) => (prev.future.length === 0 ? prev : { past: [...prev.past, prev.present], present: prev.future[0]!, future: prev.future.slice(1) }));
  }, []);
  const reset = useCallback((value: T) => {
    last.current = { key: undefined, at: 0 };
    setH({ past: [], present: value, future: [] });
  }, []);
  return { value: h.present, set, undo, redo, reset, canUndo: h.past.length > 0, canRedo: h.future.length > 0 };
}
