/* output.c - temporary file, then rename; never overwrite an input. */
#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "output.h"

#define MAX_PROTECT 64
#define MAX_TEMP 64

static struct {
	dev_t dev;
	ino_t ino;
} protect[MAX_PROTECT];
static size_t nprotect;

/* Temporary files alive now; the signal handler unlinks them. */
static char *volatile live_tmp[MAX_TEMP];

void
hl_output_protect(const char *input)
{
	struct stat st;

	if (input == NULL || nprotect == MAX_PROTECT)
		return;
	if (stat(input, &st) != 0)
		return;
	protect[nprotect].dev = st.st_dev;
	protect[nprotect].ino = st.st_ino;
	nprotect++;
}

static void
on_signal(int sig)
{
	size_t i;

	for (i = 0; i < MAX_TEMP; i++)
		if (live_tmp[i] != NULL)
			unlink(live_tmp[i]);
	signal(sig, SIG_DFL);
	raise(sig);
}

void
hl_output_install_signals(void)
{
	struct sigaction sa;

	memset(&sa, 0, sizeof sa);
	sa.sa_handler = on_signal;
	sigemptyset(&sa.sa_mask);
	sigaction(SIGINT, &sa, NULL);
	sigaction(SIGTERM, &sa, NULL);
	sigaction(SIGHUP, &sa, NULL);
}

static void
track(char *tmp, int on)
{
	size_t i;

	for (i = 0; i < MAX_TEMP; i++) {
		if (on && live_tmp[i] == NULL) {
			live_tmp[i] = tmp;
			return;
		}
		if (!on && live_tmp[i] == tmp) {
			live_tmp[i] = NULL;
			return;
		}
	}
}

hl_status
hl_output_check(const char *path, hl_error *err)
{
	struct stat st;
	size_t i;

	if (path == NULL || strcmp(path, "-") == 0)
		return HL_OK;
	if (stat(path, &st) != 0)
		return HL_OK;
	for (i = 0; i < nprotect; i++)
		if (protect[i].dev == st.st_dev && protect[i].ino == st.st_ino)
			return hl_error_set(err, HL_EUSAGE, path, 0,
				"refusing to overwrite an input file; choose "
				"another output name");
	if (S_ISDIR(st.st_mode))
		return hl_error_set(err, HL_EUSAGE, path, 0,
			"is a folder; give a file name");
	return HL_OK;
}

/* A device, pipe or socket (/dev/null, a FIFO, /dev/stdout): renaming a
 * file over it would replace the device, and a reader of a pipe waits for
 * the path it opened, so these are written in place. */
static int
is_stream(const char *path)
{
	struct stat st;

	return stat(path, &st) == 0 && !S_ISREG(st.st_mode) &&
	       !S_ISDIR(st.st_mode);
}

static hl_status
open_stream(hl_output *o, const char *path, hl_error *err)
{
	o->fp = fopen(path, "w");
	if (o->fp == NULL)
		return hl_error_set(err, HL_EIO, path, 0, "cannot write: %s",
			strerror(errno));
	o->path = strdup(path);
	if (o->path == NULL) {
		fclose(o->fp);
		o->fp = NULL;
		return hl_error_nomem(err);
	}
	return HL_OK;
}

hl_status
hl_output_open(hl_output *o, const char *path, hl_error *err)
{
	hl_status st;
	int fd;

	memset(o, 0, sizeof *o);
	if (path == NULL || strcmp(path, "-") == 0) {
		o->fp = stdout;
		return HL_OK;
	}
	st = hl_output_check(path, err);
	if (st != HL_OK)
		return st;
	if (is_stream(path))
		return open_stream(o, path, err);
	o->path = strdup(path);
	o->tmp = malloc(strlen(path) + 16);
	if (o->path == NULL || o->tmp == NULL) {
		hl_output_abort(o);
		return hl_error_nomem(err);
	}
	strcpy(o->tmp, path);
	strcat(o->tmp, ".tmp-XXXXXX");
	track(o->tmp, 1);
	fd = mkstemp(o->tmp);
	if (fd < 0) {
		int e = errno;

		track(o->tmp, 0);
		free(o->tmp);
		o->tmp = NULL;
		hl_output_abort(o);
		return hl_error_set(err, HL_EIO, path, 0, "cannot write: %s",
			strerror(e));
	}
	{
		mode_t mask = umask(0);

		umask(mask);
		fchmod(fd, 0666 & ~mask);
	}
	o->fp = fdopen(fd, "w");
	if (o->fp == NULL) {
		close(fd);
		hl_output_abort(o);
		return hl_error_set(err, HL_EIO, path, 0, "cannot write");
	}
	return HL_OK;
}

hl_status
hl_output_commit(hl_output *o, hl_error *err)
{
	int bad;

	if (o->fp == stdout) {
		o->fp = NULL;
		if (fflush(stdout) != 0)
			return hl_error_set(err, HL_EIO, "stdout", 0,
				"write error");
		return HL_OK;
	}
	if (o->fp == NULL)
		return HL_OK;
	bad = ferror(o->fp) != 0;
	bad |= fclose(o->fp) != 0;
	o->fp = NULL;
	if (o->tmp == NULL && !bad) {	/* written in place (open_stream) */
		free(o->path);
		o->path = NULL;
		return HL_OK;
	}
	if (bad || o->tmp == NULL || rename(o->tmp, o->path) != 0) {
		int e = errno;

		hl_output_abort(o);
		return hl_error_set(err, HL_EIO, o->path ? o->path : "", 0,
			"cannot write: %s", strerror(e));
	}
	track(o->tmp, 0);
	free(o->tmp);
	o->tmp = NULL;
	free(o->path);
	o->path = NULL;
	return HL_OK;
}

void
hl_output_abort(hl_output *o)
{
	if (o->fp != NULL && o->fp != stdout)
		fclose(o->fp);
	o->fp = NULL;
	if (o->tmp != NULL) {
		unlink(o->tmp);
		track(o->tmp, 0);
		free(o->tmp);
	}
	o->tmp = NULL;
	free(o->path);
	o->path = NULL;
}
