// JSON prints a non-finite number as null: every JSON answer is walked once before it is sent.

/** The path of the first non-finite number in a JSON-bound value (e.g. `answer.bodies[0].mass`), or null. */
export function firstNonFinite(value: unknown, path = 'answer'): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = firstNonFinite(value[i], `${path}[${i}]`);
      if (hit !== null) return hit;
    }
    return null;
  }
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const hit = firstNonFinite(v, `${path}.${k}`);
      if (hit !== null) return hit;
    }
  }
  return null;
}
