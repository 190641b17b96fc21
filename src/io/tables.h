/* tables.h - the stream table and the utility table (CSV), design.md.
 *
 * Stream table columns: name, supply, target (°C), cp (kW/K) or duty (kW);
 * optional h (kW/(m²·K)), dt_contrib (K), kind (hot|cold), area (plant area
 * tag), cp_tol (relative), t_tol (K). Consecutive rows with one name whose
 * temperatures chain form one segmented stream.
 *
 * Utility table columns: name, kind (hot|cold), supply, target (°C), price
 * (per MWh); optional h, max_load (kW), dt_contrib (K).
 *
 * Both append to a case; on error the case holds what was read before the bad
 * row, and the caller is expected to discard it.
 */
#ifndef HL_TABLES_H
#define HL_TABLES_H

#include <stddef.h>

#include "case.h"
#include "status.h"

hl_status hl_stream_table_read(hl_case *c, const char *path, hl_error *err);
hl_status hl_stream_table_read_mem(hl_case *c, const char *name,
				   const char *data, size_t len, hl_error *err);
hl_status hl_utility_table_read(hl_case *c, const char *path, hl_error *err);
hl_status hl_utility_table_read_mem(hl_case *c, const char *name,
				    const char *data, size_t len,
				    hl_error *err);

#endif
