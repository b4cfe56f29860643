import type { DesignDraft, RevisionComparison } from '../../shared/api/api-schemas';

/*
 * What differs between two designs, value by value, each named by its JSON pointer into the
 * design. Fittings are compared by kind rather than by place in the list, so a reordered list is
 * no change and a new elbow is one.
 */

type Scalar = number | string | boolean | null;
type Change = RevisionComparison['changes'][number];

function flatten(value: unknown, pointer: string, into: Map<string, Scalar>): void {
  if (value === null || typeof value !== 'object') {
    into.set(pointer, value as Scalar);
    return;
  }
  if (Array.isArray(value)) {
    // arrangement lists and the like are one value: [1, 2] against [1, 2, 3]
    if (value.every((item) => typeof item !== 'object')) into.set(pointer, value.join(', '));
    else value.forEach((item, index) => flatten(item, `${pointer}/${index}`, into));
    return;
  }
  for (const [key, item] of Object.entries(value)) {
    if (key === 'fittings' && Array.isArray(item)) {
      for (const fitting of item as Array<{ kind: string; count: number }>) {
        const at = `${pointer}/fittings/${fitting.kind}`;
        into.set(at, ((into.get(at) as number | undefined) ?? 0) + fitting.count);
      }
    } else flatten(item, `${pointer}/${key}`, into);
  }
}

/** Every value of `before` and `after` that differs; a fitting or segment on one side only is null on the other. */
export function designChanges(before: DesignDraft, after: DesignDraft): Change[] {
  const was = new Map<string, Scalar>();
  const now = new Map<string, Scalar>();
  flatten(before, '', was);
  flatten(after, '', now);
  const pointers = [...new Set([...was.keys(), ...now.keys()])];
  return pointers
    .filter((pointer) => (was.get(pointer) ?? null) !== (now.get(pointer) ?? null))
    .filter((pointer) => !/\/fittings\//.test(pointer) || (was.get(pointer) ?? 0) !== (now.get(pointer) ?? 0))
    .map((pointer) => ({ pointer, from: was.get(pointer) ?? null, to: now.get(pointer) ?? null }));
}
