import { jsonPointer } from './json-pointer';
import type { ParameterChange } from './types';

function isContainer(value: unknown): value is object {
  return value !== null && typeof value === 'object';
}

function walk(before: unknown, after: unknown, path: string, rows: ParameterChange[]): void {
  const bothArrays = Array.isArray(before) && Array.isArray(after);
  const bothObjects = isContainer(before) && isContainer(after) && !Array.isArray(before) && !Array.isArray(after);
  if (bothArrays) {
    const length = Math.max(before.length, after.length);
    for (let i = 0; i < length; i++) walk(before[i], after[i], jsonPointer(path, i), rows);
    return;
  }
  if (bothObjects) {
    const beforeRecord = before as Record<string, unknown>;
    const afterRecord = after as Record<string, unknown>;
    // Sorted, as canonical JSON sorts them, so the table does not depend on key order.
    const keys = [...new Set([...Object.keys(beforeRecord), ...Object.keys(afterRecord)])].sort();
    for (const key of keys) {
      // A key holding undefined is the same as no key, as in JSON.
      walk(beforeRecord[key], afterRecord[key], jsonPointer(path, key), rows);
    }
    return;
  }
  // Leaves, or a container replaced by another kind of value: one row for the whole value. === makes -0 = 0.
  if (before !== after) rows.push({ path, before, after });
}

/**
 * The parameter changes between two definitions (or any plain-data trees: seed, axes, layout, boundaries), one
 * row per changed leaf, as { path, before, after }: `path` a JSON Pointer (RFC 6901), '' for the root; object
 * keys visited in sorted order, arrays index by index (an entry beyond the shorter array is added or removed:
 * `before` or `after` undefined). A value replaced by one of another kind (a number by an object, an array by
 * an object) is one row for the whole value; two objects are compared key by key, so a layout of another kind
 * shows `/layout/kind` and each key it gained or lost. Numbers compare exactly (the diff of two frozen editions
 * shows what was typed), with -0 equal to 0. Never mutates.
 */
export function diffParameters(oldDefinition: unknown, newDefinition: unknown): readonly ParameterChange[] {
  const rows: ParameterChange[] = [];
  walk(oldDefinition, newDefinition, '', rows);
  return rows;
}
