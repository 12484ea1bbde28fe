// The password length rule on its own, for client components: importing password-rules.ts would bring the common
// passwords dictionary into the browser bundle.
export const PASSWORD_MIN_LENGTH = 10;
