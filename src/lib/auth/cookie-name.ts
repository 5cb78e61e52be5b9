/** The session cookie's name (lucia.ts); the page memory keeps pages only for requests carrying it. */
export const SESSION_COOKIE = "pulsefence_session";
