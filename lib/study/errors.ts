/** An input a user can fix: names the field (dotted path into the study) and says what is wrong. */
export class StudyInputError extends Error {
  constructor(
    public readonly field: string,
    public readonly detail: string,
  ) {
    super(`${field}: ${detail}`);
    this.name = "StudyInputError";
  }
}
