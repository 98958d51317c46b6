/**
 * What a new password must be beyond its length (OWASP ASVS 5.0 V6.2): not one that is common or
 * easily guessed — judged by zxcvbn's estimate against its common-password, name and English
 * dictionaries, which must reach score 3 ("safely unguessable: moderate protection from offline
 * slow-hash scenario") — and not built from the person's own e-mail address or name.
 */
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as english from "@zxcvbn-ts/language-en";
import { validationFailed } from "../errors.ts";

const estimator = new ZxcvbnFactory({
  dictionary: { ...common.dictionary, ...english.dictionary },
  graphs: common.adjacencyGraphs,
  translations: english.translations,
});

export const PASSWORD_SCORE_MIN = 3;

/** Throws a validation error on `field` when the password is too easy to guess for this person. */
export function assertStrongPassword(password: string, owner: { email: string; name?: string | null }, field: string): void {
  const email = owner.email.toLowerCase();
  const local = email.split("@")[0] ?? "";
  const lower = password.toLowerCase();
  if (lower.includes(email) || (local.length >= 4 && lower.includes(local)))
    throw validationFailed([{ path: field, message: "Do not build the password from your e-mail address." }]);
  const result = estimator.check(password, [email, local, ...(owner.name ? owner.name.split(/\s+/) : []), "cellarpact"]);
  if (result.score < PASSWORD_SCORE_MIN) {
    const hint = [result.feedback.warning, ...result.feedback.suggestions].filter(Boolean).join(" ");
    throw validationFailed([
      { path: field, message: `This password is too easy to guess.${hint ? ` ${hint}` : ""} A few unrelated words make a strong one.` },
    ]);
  }
}
