// Passwords too common to accept: the "passwords-common" dictionary of @zxcvbn-ts/language-common (MIT; about 49,000
// entries taken from published breached-password frequency lists, lower case), shipped inside the package, so nothing
// is downloaded at run time. The set is built on first use, not when a form module that only needs a constant loads.
import { dictionary } from "@zxcvbn-ts/language-common";

let common: ReadonlySet<string> | undefined;

/** Whether `password`, lower-cased, is in the dictionary. */
export function isCommonPassword(password: string): boolean {
  common ??= new Set(dictionary["passwords-common"].map((p) => p.toLowerCase()));
  return common.has(password.toLowerCase());
}
