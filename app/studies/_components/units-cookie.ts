/** Name of the cookie that remembers the display units (read on the server, written by the switch). */
export const UNITS_COOKIE = "stoke-units";
