// Value formats shared by the identifier tables.

/** CAGE / NCAGE code: five letters or digits (trade-facts 1.2, SIDI list "an3+an5"). */
export const isCage = (value: string): boolean => /^[A-Z0-9]{5}$/.test(value);

/** Characters allowed in a UII: A-Z, 0-9, "-", "/"; at most 50 (uidlaser, trade-facts 1.2). */
export const isUiiText = (value: string): boolean => /^[A-Z0-9\-/]{1,50}$/.test(value);

/** Printable ASCII, the general-purpose value of a DI or TEI. */
export const isPrintable = (value: string): boolean => /^[\x20-\x7E]+$/.test(value);

/** DUNS number: nine digits [from memory]. */
export const isDuns = (value: string): boolean => /^\d{9}$/.test(value);
