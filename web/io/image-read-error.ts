/** A pilot image refused while it is read, with the reason in the user's words (shown as is on the page). */
export class ImageReadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ImageReadError';
  }
}
