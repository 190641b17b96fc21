/* audit_private.h - shared by audit.c, audit_pinch.c and audit_share.c;
 * not part of the library's contract. */
#ifndef HL_AUDIT_PRIVATE_H
#define HL_AUDIT_PRIVATE_H

#include "audit.h"
#include "curves.h"

/* The pinch-rule violations of a->net at a->pinch, ranked. */
hl_status hl_audit_violations(const hl_case *c, hl_audit *a, hl_error *err);

/* Each unit's vertical-transfer area and share on the curves cv (balanced
 * when cv has them, else the process composites: recovery units only). */
void hl_audit_shares(const hl_case *c, hl_audit *a, const hl_curves *cv);

#endif
