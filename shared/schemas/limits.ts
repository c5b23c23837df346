/** Limits both the forms and the server enforce, kept in one place. */
export const PASSWORD_MIN_LENGTH = 10;
/** argon2 hashes any length, but a cap keeps hashing cost bounded per request. */
export const PASSWORD_MAX_LENGTH = 200;
export const NAME_MAX_LENGTH = 120;
export const EMAIL_MAX_LENGTH = 254;
export const TOKEN_NAME_MAX_LENGTH = 80;
