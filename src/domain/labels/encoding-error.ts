/** Thrown by our label encoders when a value cannot be written into the label. */
export class LabelEncodingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "LabelEncodingError";
  }
}
