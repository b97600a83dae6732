// The error a correction of the sheet's letters throws when it cannot be made (a
// merge of one letter, a split that leaves one side empty, a cut outside the ink).
// The message is shown to the user as it is: it says what was wrong and what to do.

/** A sheet correction that cannot be made; `message` is for the user. */
export class SheetEditError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SheetEditError';
  }
}
