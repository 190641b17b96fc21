/* utf8.c - characters of UTF-8 text (utf8.h). */
#include "utf8.h"

size_t
hl_utf8_chars_n(const char *s, size_t len)
{
	size_t i, n = 0;

	for (i = 0; i < len && s[i] != '\0'; i++)
		n += !HL_UTF8_CONT(s[i]);
	return n;
}

size_t
hl_utf8_chars(const char *s)
{
	size_t n = 0;

	for (; *s != '\0'; s++)
		n += !HL_UTF8_CONT(*s);
	return n;
}
