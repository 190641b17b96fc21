/* audit_int.h - shared by audit.c, audit_pinch.c and audit_share.c;
 * not part of the library's contract. */
#ifndef HL_AUDIT_INT_H
#define HL_AUDIT_INT_H

#include "audit.h"
#include "curves.h"

/* The pinch-rule violations of a->net at a->pinch, ranked. */
hl_status hl_audit_violations(const hl_case *c, hl_audit *a, hl_error *err);

/* Each unit's vertical-transfer area and share at today's energy: on the
 * balanced composites with today's loads, or without utilities on the
 * process composites (recovery units only). */
hl_status hl_audit_shares(const hl_case *c, hl_audit *a, hl_error *err);

#endif
