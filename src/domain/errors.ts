/**
 * Thrown by the pure domain code when a value handed to it cannot be used as given.
 * `field` names the input at fault so callers (route handlers, forms) can point at it;
 * the server layer maps this error to a 422 with `fields: { [field]: message }`.
 */
export class DomainInputError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = "DomainInputError";
  }
}
