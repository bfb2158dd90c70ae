import { all, create, type MathNode } from 'mathjs';
import { InputError } from '../../contracts/input-error.js';

/**
 * Arithmetic expressions for derived parameters ("f * sigma8",
 * "(omegaB + omegaCdm) / h^2"), parsed and evaluated with mathjs in a locked-down
 * scope. Two fences:
 *  1. the mathjs instance has import, createUnit, evaluate, parse, simplify,
 *     derivative, compile, resolve and chain replaced by functions that throw
 *     (the mathjs documentation, "Security": these reach outside an expression);
 *  2. every parsed tree is checked against a whitelist before it is compiled:
 *     numbers, the declared variable names, pi and e, the operators + - * / ^
 *     (also unary), parentheses, and calls of a short list of elementary
 *     functions by name. Anything else (assignments, function definitions,
 *     property access, indexing, objects, arrays, strings, units, conditionals,
 *     ranges, blocks) is refused before it can run.
 */
const math = create(all, { predictable: true });
const mathParse = math.parse;

function disabled(name: string) {
  return () => {
    throw new Error(`mathjs function ${name} is disabled`);
  };
}
math.import(
  Object.fromEntries(['import', 'createUnit', 'evaluate', 'parse', 'simplify', 'derivative', 'compile', 'resolve', 'chain', 'reviver', 'parser'].map((n) => [n, disabled(n)])),
  { override: true },
);

const FUNCTIONS = new Set(['sqrt', 'cbrt', 'exp', 'log', 'log10', 'pow', 'abs', 'sin', 'cos', 'tan', 'min', 'max', 'square']);
const OPERATORS = new Set(['add', 'subtract', 'multiply', 'divide', 'pow', 'unaryMinus', 'unaryPlus']);
const CONSTANTS = new Set(['pi', 'e']);

export interface SafeExpression {
  readonly text: string;
  /** Variable names the expression reads. */
  readonly variables: readonly string[];
  /** Value for the given variables; NaN when one is missing or the result is not a real number. */
  evaluate(values: Readonly<Record<string, number>>): number;
}

function refuse(key: string, text: string, why: string): never {
  throw new InputError(`${key}: expression "${text}" is refused: ${why}`, { where: key, hint: 'derived expressions may use numbers, parameter names, + - * / ^, parentheses and sqrt, cbrt, exp, log, log10, pow, abs, sin, cos, tan, min, max, square' });
}

function check(node: MathNode, allowed: ReadonlySet<string>, used: Set<string>, key: string, text: string): void {
  const n = node as MathNode & { value?: unknown; name?: string; fn?: unknown; op?: string; args?: MathNode[] };
  switch (node.type) {
    case 'ConstantNode':
      if (typeof n.value !== 'number') refuse(key, text, `only numbers are allowed as constants, found ${JSON.stringify(n.value)}`);
      return;
    case 'SymbolNode':
      if (FUNCTIONS.has(n.name as string) || !(allowed.has(n.name as string) || CONSTANTS.has(n.name as string))) refuse(key, text, `unknown name '${n.name}' (known: ${[...allowed].join(', ')})`);
      if (allowed.has(n.name as string)) used.add(n.name as string);
      return;
    case 'ParenthesisNode':
      break;
    case 'OperatorNode':
      if (!OPERATORS.has(n.fn as string)) refuse(key, text, `operator '${n.op}' is not allowed`);
      break;
    case 'FunctionNode': {
      const fn = n.fn as MathNode & { name?: string };
      if (fn.type !== 'SymbolNode' || !FUNCTIONS.has(fn.name as string)) refuse(key, text, `call of '${fn.type === 'SymbolNode' ? fn.name : fn.toString()}' is not allowed`);
      for (const a of n.args ?? []) check(a, allowed, used, key, text);
      return;
    }
    default:
      refuse(key, text, `${node.type} '${node.toString()}' is not allowed`);
  }
  node.forEach((child) => check(child, allowed, used, key, text));
}

/** Parse and vet an expression over the given variable names; `key` names it in errors. */
export function compileSafeExpression(text: string, variables: Iterable<string>, key: string): SafeExpression {
  if (typeof text !== 'string' || text.trim() === '') refuse(key, String(text), 'it must be a non-empty string');
  if (text.length > 500) refuse(key, text.slice(0, 40) + '...', 'longer than 500 characters');
  let tree: MathNode;
  try {
    tree = mathParse(text);
  } catch (e) {
    refuse(key, text, `it does not parse (${(e as Error).message})`);
  }
  const allowed = new Set(variables);
  const used = new Set<string>();
  check(tree, allowed, used, key, text);
  const code = tree.compile();
  const names = [...used];
  return {
    text,
    variables: names,
    evaluate(values) {
      const scope = new Map<string, number>();
      for (const v of names) {
        const x = values[v];
        if (x === undefined) return Number.NaN;
        scope.set(v, x);
      }
      const r: unknown = code.evaluate(scope);
      return typeof r === 'number' ? r : Number.NaN;
    },
  };
}
