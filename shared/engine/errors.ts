// Engine errors carry a stable code so the API and the CLI can map them without parsing messages;
// parse errors also carry the 1-based line and column where reading stopped.
export class EngineError extends Error {
  readonly code: string;
  constructor(code: string, message: string) {
    super(message);
    this.name = "EngineError";
    this.code = code;
  }
}

export class ParseError extends EngineError {
  readonly line: number;
  readonly column: number;
  constructor(message: string, line: number, column: number, code = "PARSE_ERROR") {
    super(code, `${message} (line ${line}, column ${column})`);
    this.name = "ParseError";
    this.line = line;
    this.column = column;
    this.reason = message;
  }
  readonly reason: string;
}

/** Thrown when a long computation sees its shouldStop() callback answer true. */
export class CancelledError extends EngineError {
  constructor() {
    super("CANCELLED", "The computation was cancelled");
    this.name = "CancelledError";
  }
}
