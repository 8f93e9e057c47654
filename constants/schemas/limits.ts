/** Field length limits shared by forms and the server. */
export const EMAIL_MAX = 254;
export const NAME_MAX = 120;
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 200;
export const TOKEN_MAX = 200;
