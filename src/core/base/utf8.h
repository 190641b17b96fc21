/* utf8.h - characters of UTF-8 text, for lining up columns and sizing
 * labels: printf and strlen count bytes, a reader sees characters. */
#ifndef HL_UTF8_H
#define HL_UTF8_H

#include <stddef.h>

/* Characters (not bytes) of s: every byte that does not continue one. */
size_t hl_utf8_chars(const char *s);
/* The same for the first len bytes of s (or up to its end). */
size_t hl_utf8_chars_n(const char *s, size_t len);
/* Whether byte b continues a character begun before it. */
#define HL_UTF8_CONT(b) ((((unsigned char)(b)) & 0xc0) == 0x80)

#endif
