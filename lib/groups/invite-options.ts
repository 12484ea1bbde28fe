// Invite lifetimes on their own, for the invite form (a client component): schemas.ts also holds the password rules,
// whose common-passwords dictionary must stay out of the browser bundle.
export const INVITE_LIFETIMES_DAYS = [1, 7, 14] as const;
