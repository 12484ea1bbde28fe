// Messages for the error codes next-auth puts in the sign-in page's URL (next-auth v4 "Errors" documentation).
// Codes we do not know get the generic line, so nothing unexpected is echoed from the URL onto the page.
const MESSAGES: Record<string, string> = {
  CredentialsSignin: "That email and password do not match an account.",
  AccessDenied: "Your institution's sign-on did not confirm an email address, so Layerwise cannot tell who you are.",
  OAuthSignin: "Could not reach the institutional sign-on service. Try again, or use your email and password.",
  OAuthCallback: "The institutional sign-on did not complete. Try again.",
  OAuthAccountNotLinked: "This email is already used with a different way of signing in.",
  SessionRequired: "Sign in to continue.",
};

export function signInErrorMessage(code: string | undefined): string | null {
  if (!code) return null;
  return MESSAGES[code] ?? "Sign-in did not work. Try again.";
}
