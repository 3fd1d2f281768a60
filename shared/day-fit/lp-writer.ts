/** A term of a linear expression: coefficient and variable name. */
export type Term = readonly [number, string];

interface Row {
  terms: Term[];
  sense: '>=' | '<=' | '=';
  rhs: number;
}

/**
 * Writes a mixed-integer model in CPLEX LP format (what HiGHS reads). Variables are declared
 * with bounds and a kind; rows are collected, then `text(objective, extraRows)` writes the
 * model, so the lexicographic levels reuse one set of rows.
 *
 * @example
 * const lp = new LpWriter(); lp.variable('x', 'integer', 0, 9); lp.row([[1, 'x']], '>=', 2);
 * lp.text([[1, 'x']]); // 'Minimize\n obj: + 1 x\nSubject To\n c0: + 1 x >= 2\n…'
 */
export class LpWriter {
  private readonly kinds = new Map<string, { kind: 'binary' | 'integer' | 'continuous'; lb: number; ub: number }>();
  private readonly rows: Row[] = [];

  variable(name: string, kind: 'binary' | 'integer' | 'continuous', lb = 0, ub = kind === 'binary' ? 1 : Infinity): string {
    this.kinds.set(name, { kind, lb, ub });
    return name;
  }

  has(name: string): boolean {
    return this.kinds.has(name);
  }

  /** Adds `Σ terms sense rhs`; terms on the same variable are summed, zero terms dropped. */
  row(terms: readonly Term[], sense: Row['sense'], rhs: number): void {
    const merged = new Map<string, number>();
    for (const [c, v] of terms) merged.set(v, (merged.get(v) ?? 0) + c);
    const kept: Term[] = [...merged].filter(([, c]) => c !== 0).map(([v, c]) => [c, v] as const);
    if (kept.length === 0) return;
    this.rows.push({ terms: kept, sense, rhs });
  }

  get size(): { variables: number; rows: number } {
    return { variables: this.kinds.size, rows: this.rows.length };
  }

  text(objective: readonly Term[], extra: readonly Row[] = []): string {
    const out: string[] = ['Minimize', ` obj: ${expr(objective.length > 0 ? objective : [[0, this.kinds.keys().next().value ?? 'zero']])}`, 'Subject To'];
    let n = 0;
    for (const row of [...this.rows, ...extra]) out.push(` c${n++}: ${expr(row.terms)} ${row.sense} ${num(row.rhs)}`);
    out.push('Bounds');
    const binaries: string[] = [];
    const integers: string[] = [];
    for (const [name, { kind, lb, ub }] of this.kinds) {
      if (kind === 'binary') binaries.push(name);
      else {
        if (kind === 'integer') integers.push(name);
        out.push(ub === Infinity ? ` ${name} >= ${num(lb)}` : ` ${num(lb)} <= ${name} <= ${num(ub)}`);
      }
    }
    if (binaries.length) out.push('Binary', ...chunk(binaries));
    if (integers.length) out.push('General', ...chunk(integers));
    out.push('End', '');
    return out.join('\n');
  }
}

export function lpRow(terms: readonly Term[], sense: Row['sense'], rhs: number): Row {
  return { terms: [...terms], sense, rhs };
}

function expr(terms: readonly Term[]): string {
  // LP lines are limited in length by some readers: break long expressions.
  const parts = terms.map(([c, v]) => `${c < 0 ? '-' : '+'} ${num(Math.abs(c))} ${v}`);
  const lines: string[] = [];
  for (let i = 0; i < parts.length; i += 40) lines.push(parts.slice(i, i + 40).join(' '));
  return lines.join('\n   ');
}

function num(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`not a finite coefficient: ${x}`);
  return Number.isInteger(x) ? String(x) : x.toFixed(6);
}

function chunk(names: string[]): string[] {
  const lines: string[] = [];
  for (let i = 0; i < names.length; i += 40) lines.push(' ' + names.slice(i, i + 40).join(' '));
  return lines;
}
