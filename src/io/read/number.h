/* number.h - how every reader (CSV tables, XML attributes) and every
 * command-line option reads a number, so that a value is accepted or
 * refused the same way wherever it is written. */
#ifndef HL_NUMBER_H
#define HL_NUMBER_H

/* Parse a decimal number strictly: optional sign, digits with an optional
 * point (or comma when decimal_comma), optional exponent, blanks around
 * it; no inf, nan, hex or trailing text. Returns 1 on success. */
int hl_parse_number(const char *s, int decimal_comma, double *out);

#endif
