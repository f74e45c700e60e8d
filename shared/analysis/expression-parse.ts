/**
 * Parser for the machine form of expressions (CONTRACTS §2): labels, `~` `&` `^` `|`, parentheses,
 * `0`, `1`; precedence ~ over & over ^ over |. Used to read expressions back and check them.
 */
export type Expr =
  | { kind: 'const'; value: boolean }
  | { kind: 'var'; name: string }
  | { kind: 'not'; arg: Expr }
  | { kind: 'and' | 'or' | 'xor'; args: Expr[] };

/** Parses an expression; throws an Error naming the position of the first problem. */
export function parseExpression(text: string): Expr {
  const tokens = [...text.matchAll(/\s*([A-Za-z_][A-Za-z0-9_]*|[01~&|^()]|\S)/g)].map((m) => ({ t: m[1], at: m.index ?? 0 }));
  let i = 0;
  const peek = () => tokens[i]?.t;
  const fail = (msg: string): never => { throw new Error(`${msg} at ${tokens[i]?.at ?? text.length}`); };
  const binary = (op: string, kind: 'and' | 'or' | 'xor', sub: () => Expr) => (): Expr => {
    const args = [sub()];
    while (peek() === op) { i++; args.push(sub()); }
    return args.length === 1 ? args[0] : { kind, args };
  };
  const unary = (): Expr => {
    const t = peek();
    if (t === '~') { i++; return { kind: 'not', arg: unary() }; }
    if (t === '(') {
      i++;
      const e = orExpr();
      if (peek() !== ')') fail('expected )');
      i++;
      return e;
    }
    if (t === '0' || t === '1') { i++; return { kind: 'const', value: t === '1' }; }
    if (t && /^[A-Za-z_]/.test(t)) { i++; return { kind: 'var', name: t }; }
    return fail(t === undefined ? 'unexpected end' : `unexpected "${t}"`);
  };
  const andExpr = binary('&', 'and', unary);
  const xorExpr = binary('^', 'xor', andExpr);
  const orExpr = binary('|', 'or', xorExpr);
  const e = orExpr();
  if (i < tokens.length) fail(`unexpected "${peek()}"`);
  return e;
}

/** Evaluates a parsed expression; unknown names throw. */
export function evaluate(e: Expr, env: Readonly<Record<string, boolean>>): boolean {
  switch (e.kind) {
    case 'const': return e.value;
    case 'var': {
      if (!(e.name in env)) throw new Error(`unknown name ${e.name}`);
      return env[e.name];
    }
    case 'not': return !evaluate(e.arg, env);
    case 'and': return e.args.every((a) => evaluate(a, env));
    case 'or': return e.args.some((a) => evaluate(a, env));
    case 'xor': return e.args.reduce((acc, a) => acc !== evaluate(a, env), false);
    default: {
      const never: never = e;
      throw new Error(`unknown expression ${JSON.stringify(never)}`);
    }
  }
}

/** Truth column of an expression over the given names (first name most significant). */
export function expressionColumn(e: Expr, names: string[]): boolean[] {
  const n = names.length;
  return Array.from({ length: 1 << n }, (_, m) => {
    const env: Record<string, boolean> = {};
    names.forEach((name, i) => { env[name] = Boolean(m & (1 << (n - 1 - i))); });
    return evaluate(e, env);
  });
}
