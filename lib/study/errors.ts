import { InputError } from "../errors";

/**
 * An input a user can fix: names the field (dotted path into the study) and says what is wrong.
 * An InputError (lib/errors.ts), kept as its own name while the edges still catch it by this name.
 */
export class StudyInputError extends InputError {
  constructor(field: string, detail: string) {
    super(field, detail);
    this.name = "StudyInputError";
  }
}
