/** A count with its noun in the right number: `plural(1, 'row')` → "1 row", `plural(4, 'row')` → "4 rows". */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString('en')} ${n === 1 ? one : many}`;
}
