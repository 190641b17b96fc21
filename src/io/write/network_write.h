/* network_write.h - a designed network as text, XML and CSV.
 *
 * The writers print what the network holds and compute nothing but the
 * stream chains of the text report. The XML element <network> carries
 * everything `heatloom check` needs to verify the network on its own
 * (doc/results.md, "Network"); network_read.h reads it back.
 */
#ifndef HL_NETWORK_WRITE_H
#define HL_NETWORK_WRITE_H

#include <stdio.h>

#include <libxml/xmlwriter.h>

#include "network.h"


/* A report for an engineer: summary, table, stream chains, notes, the
 * assumptions and the caution (may be NULL). */
void hl_network_text(FILE *fp, const hl_network *net, const char *caution);

/* <network …> with its streams, utilities, exchangers and notes. Returns
 * < 0 on a writer failure, like libxml2. */
int hl_network_xml(xmlTextWriterPtr w, const hl_network *net);

/* One row per exchanger under a header row. */
void hl_network_csv(FILE *fp, const hl_network *net);

#endif
