// Refusals of a run request (bad parameters, full queue); the runs router turns them into HTTP errors.
export class RunRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "RunRequestError";
  }
}
