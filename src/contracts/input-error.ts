/**
 * The one error type for bad user input. The CLI prints `message` as a single
 * line (plus `hint` when given) and never a stack trace. The message must name
 * the offending thing: a config key ("cosmology.h"), a file, a row or column.
 */
export class InputError extends Error {
  readonly hint: string | undefined;
  /** Where the problem is: a key path, "file:line", or "file:row:column". */
  readonly where: string | undefined;

  constructor(message: string, options: { hint?: string; where?: string } = {}) {
    super(message);
    this.name = 'InputError';
    this.hint = options.hint;
    this.where = options.where;
  }
}

/** Several input problems found at once (a config validated up front). */
export class InputErrors extends InputError {
  readonly problems: readonly string[];

  constructor(problems: readonly string[], hint?: string) {
    super(
      problems.length === 1 ? problems[0] : `${problems.length} problems:\n  - ${problems.join('\n  - ')}`,
      hint === undefined ? {} : { hint },
    );
    this.name = 'InputErrors';
    this.problems = problems;
  }
}
