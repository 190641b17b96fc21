/* tables.h - the stream table and the utility table (CSV), doc/formats.md.
 *
 * Stream table columns: name, supply, target (°C), cp (kW/K) or duty (kW);
 * optional h (kW/(m²·K)), dt_contrib (K), kind (hot|cold), area (plant area
 * tag), cp_tol (relative), t_tol (K). Consecutive rows with one name whose
 * temperatures chain form one segmented stream.
 *
 * Utility table columns: name, kind (hot|cold), supply, target (°C), price
 * (per MWh); optional h, max_load (kW), dt_contrib (K).
 *
 * Network table columns (today's exchangers, read for the audit): name, hot,
 * cold (a stream or utility name each), duty (kW, > 0); optional hot_in,
 * hot_out, cold_in, cold_out (°C), area (m², > 0), shells (a whole number
 * from 1 to HL_COUNT_MAX). Only the format is checked here; whether the units
 * balance with the streams is the audit's business.
 *
 * All three append to a case; on error the case holds what was read before
 * the bad row, and the caller is expected to discard it.
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
hl_status hl_network_table_read(hl_case *c, const char *path, hl_error *err);
hl_status hl_network_table_read_mem(hl_case *c, const char *name,
				    const char *data, size_t len,
				    hl_error *err);

/* The largest count (shells of one unit) a table or case file may give. */
#define HL_COUNT_MAX 1000

/* Parse a whole number from 1 to HL_COUNT_MAX: optional '+', digits, and
 * blanks around them; 1 on success. The CSV and XML readers share it so
 * that both accept the same text. */
int hl_parse_count(const char *s, long *out);

#endif
