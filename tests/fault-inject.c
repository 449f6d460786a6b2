/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Fault injection for the save tests (test-save-faults.c, through save-child.c): a library put
 * in front of the C library with LD_PRELOAD. While armed it counts the calls that create, write,
 * flush, close, rename and remove files, makes the chosen one fail with the chosen errno as a
 * failing disk would, and keeps a trace of every call for the test to read.
 *
 * Configured by the environment, read once when the library is loaded:
 *   TRB_FAULT_CALL    the call to fail, counted from 1 among the calls made while armed
 *                     (0 or unset: none; the trace still shows what a save does)
 *   TRB_FAULT_ERRNO   EIO, ENOSPC or EDQUOT (default EIO)
 *   TRB_FAULT_STICKY  1: every call from that one on fails too (a disk that stays full or
 *                     dead), the clean-up after the first failure included
 *   TRB_FAULT_SHORT   at most this many bytes per write() (a short write, which a full disk
 *                     gives before it refuses), so that a save takes several writes
 *
 * Only the C library is used here: GLib writes and opens files itself, and would come back
 * into these functions. */

#include "config.h"

#define _GNU_SOURCE   /* RTLD_NEXT, O_TMPFILE, off64_t, fallocate() */

/* meson asks for 64-bit file offsets, which renames open() to open64() in the headers; both
 * names are defined below, as the C library exports both. */
#undef _FILE_OFFSET_BITS

#include <dlfcn.h>
#include <errno.h>
#include <fcntl.h>
#include <limits.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/types.h>
#include <unistd.h>

/* Found by save-child.c with dlsym (RTLD_DEFAULT, ...). */
void trb_fault_arm    (void);
void trb_fault_disarm (void);
void trb_fault_report (FILE *out);

#define MAX_CALLS 1024
#define MAX_FDS   1024

typedef struct
{
  const char *name;
  char       *path;      /* the file acted on, or the old name of a rename */
  char       *path2;     /* the new name of a rename */
  int         injected;  /* made to fail here */
  int         failed;    /* failed, injected or for real */
  int         err;       /* its errno when it failed */
} Call;

static int fault_call;
static int fault_errno = EIO;
static int fault_sticky;
static size_t fault_short;

static int armed;
static int n_calls;
static Call calls[MAX_CALLS];
static char *fd_paths[MAX_FDS];   /* what the descriptors opened while armed refer to */

__attribute__((constructor)) static void
fault_init (void)
{
  const char *call = getenv ("TRB_FAULT_CALL");
  const char *err = getenv ("TRB_FAULT_ERRNO");
  const char *sticky = getenv ("TRB_FAULT_STICKY");
  const char *shortw = getenv ("TRB_FAULT_SHORT");

  fault_call = call != NULL ? atoi (call) : 0;
  if (err == NULL || strcmp (err, "EIO") == 0)
    fault_errno = EIO;
  else if (strcmp (err, "ENOSPC") == 0)
    fault_errno = ENOSPC;
  else if (strcmp (err, "EDQUOT") == 0)
    fault_errno = EDQUOT;
  else
    {
      fprintf (stderr, "fault-inject: unknown TRB_FAULT_ERRNO \"%s\"\n", err);
      abort ();
    }
  fault_sticky = sticky != NULL && strcmp (sticky, "1") == 0;
  fault_short = shortw != NULL ? (size_t) strtoul (shortw, NULL, 10) : 0;
}

static void *
real (const char *name)
{
  void *fn = dlsym (RTLD_NEXT, name);

  if (fn == NULL)
    {
      fprintf (stderr, "fault-inject: no %s after this library\n", name);
      abort ();
    }
  return fn;
}

#define REAL(type, name) \
  static type real_fn; \
  if (real_fn == NULL) \
    real_fn = (type) real (name)

static char *
dup_or_null (const char *s)
{
  return s != NULL ? strdup (s) : NULL;
}

static const char *
fd_path (int fd)
{
  return fd >= 0 && fd < MAX_FDS ? fd_paths[fd] : NULL;
}

/* Counts a call made while armed. Returns its index in the trace, or -1 when not armed; sets
 * *inject when this call is to fail. */
static int
count_call (const char *name,
            const char *path,
            const char *path2,
            int        *inject)
{
  Call *c;
  int n;

  *inject = 0;
  if (!armed || n_calls >= MAX_CALLS)
    return -1;
  n = ++n_calls;
  c = &calls[n - 1];
  c->name = name;
  c->path = dup_or_null (path);
  c->path2 = dup_or_null (path2);
  if (fault_call > 0 && (n == fault_call || (fault_sticky && n > fault_call)))
    {
      *inject = 1;
      c->injected = 1;
    }
  return n - 1;
}

/* Records how a counted call ended and gives back its result, errno kept. */
static int
end_call (int index,
          int result)
{
  int saved = errno;

  if (index >= 0 && result < 0)
    {
      calls[index].failed = 1;
      calls[index].err = saved;
    }
  errno = saved;
  return result;
}

static int
inject_failure (int index)
{
  errno = fault_errno;
  return end_call (index, -1);
}

static void
remember_fd (int         fd,
             const char *path)
{
  if (armed && fd >= 0 && fd < MAX_FDS)
    {
      free (fd_paths[fd]);
      fd_paths[fd] = dup_or_null (path);
    }
}

static void
forget_fd (int fd)
{
  if (fd >= 0 && fd < MAX_FDS && fd_paths[fd] != NULL)
    {
      free (fd_paths[fd]);
      fd_paths[fd] = NULL;
    }
}

static int
open_common (const char *name,
             int         dirfd,
             const char *path,
             int         flags,
             mode_t      mode)
{
  typedef int (*OpenAtFn) (int, const char *, int, ...);
  int inject;
  int index = count_call (name, path, NULL, &inject);
  int fd;
  REAL (OpenAtFn, "openat");

  if (inject)
    return inject_failure (index);
  fd = real_fn (dirfd, path, flags, mode);
  if (fd >= 0)
    remember_fd (fd, path);
  return end_call (index, fd);
}

static mode_t
open_mode (int     flags,
           va_list args)
{
  return (flags & O_CREAT) != 0 || (flags & O_TMPFILE) == O_TMPFILE ?
         (mode_t) va_arg (args, int) : 0;
}

int
open (const char *path,
      int         flags,
      ...)
{
  va_list args;
  mode_t mode;

  va_start (args, flags);
  mode = open_mode (flags, args);
  va_end (args);
  return open_common ("open", AT_FDCWD, path, flags, mode);
}

int
open64 (const char *path,
        int         flags,
        ...)
{
  va_list args;
  mode_t mode;

  va_start (args, flags);
  mode = open_mode (flags, args);
  va_end (args);
  return open_common ("open", AT_FDCWD, path, flags, mode);
}

int
openat (int         dirfd,
        const char *path,
        int         flags,
        ...)
{
  va_list args;
  mode_t mode;

  va_start (args, flags);
  mode = open_mode (flags, args);
  va_end (args);
  return open_common ("open", dirfd, path, flags, mode);
}

int
openat64 (int         dirfd,
          const char *path,
          int         flags,
          ...)
{
  va_list args;
  mode_t mode;

  va_start (args, flags);
  mode = open_mode (flags, args);
  va_end (args);
  return open_common ("open", dirfd, path, flags, mode);
}

ssize_t
write (int         fd,
       const void *buf,
       size_t      count)
{
  typedef ssize_t (*WriteFn) (int, const void *, size_t);
  int inject;
  int index = count_call ("write", fd_path (fd), NULL, &inject);
  REAL (WriteFn, "write");

  if (inject)
    return inject_failure (index);
  if (index >= 0 && fault_short > 0 && count > fault_short)
    count = fault_short;
  return end_call (index, real_fn (fd, buf, count));
}

int
fsync (int fd)
{
  typedef int (*FsyncFn) (int);
  int inject;
  int index = count_call ("fsync", fd_path (fd), NULL, &inject);
  REAL (FsyncFn, "fsync");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (fd));
}

int
fdatasync (int fd)
{
  typedef int (*FsyncFn) (int);
  int inject;
  int index = count_call ("fdatasync", fd_path (fd), NULL, &inject);
  REAL (FsyncFn, "fdatasync");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (fd));
}

/* As on Linux, the descriptor is gone even when close() reports an error (close(2)). */
int
close (int fd)
{
  typedef int (*CloseFn) (int);
  int inject;
  int index = count_call ("close", fd_path (fd), NULL, &inject);
  int result;
  REAL (CloseFn, "close");

  forget_fd (fd);
  result = real_fn (fd);
  if (inject)
    return inject_failure (index);
  return end_call (index, result);
}

static int
fallocate_common (int   fd,
                  int   mode,
                  off_t offset,
                  off_t length)
{
  typedef int (*FallocateFn) (int, int, off_t, off_t);
  int inject;
  int index = count_call ("fallocate", fd_path (fd), NULL, &inject);
  REAL (FallocateFn, "fallocate");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (fd, mode, offset, length));
}

int
fallocate (int   fd,
           int   mode,
           off_t offset,
           off_t length)
{
  return fallocate_common (fd, mode, offset, length);
}

/* off64_t is off_t on the 64-bit systems these tests run on */
int
fallocate64 (int     fd,
             int     mode,
             off64_t offset,
             off64_t length)
{
  _Static_assert (sizeof (off64_t) == sizeof (off_t), "64-bit file offsets");
  return fallocate_common (fd, mode, (off_t) offset, (off_t) length);
}

int
rename (const char *oldpath,
        const char *newpath)
{
  typedef int (*RenameFn) (const char *, const char *);
  int inject;
  int index = count_call ("rename", oldpath, newpath, &inject);
  REAL (RenameFn, "rename");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (oldpath, newpath));
}

int
renameat (int         olddirfd,
          const char *oldpath,
          int         newdirfd,
          const char *newpath)
{
  typedef int (*RenameAtFn) (int, const char *, int, const char *);
  int inject;
  int index = count_call ("rename", oldpath, newpath, &inject);
  REAL (RenameAtFn, "renameat");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (olddirfd, oldpath, newdirfd, newpath));
}

int
unlink (const char *path)
{
  typedef int (*UnlinkFn) (const char *);
  int inject;
  int index = count_call ("unlink", path, NULL, &inject);
  REAL (UnlinkFn, "unlink");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (path));
}

int
unlinkat (int         dirfd,
          const char *path,
          int         flags)
{
  typedef int (*UnlinkAtFn) (int, const char *, int);
  int inject;
  int index = count_call ("unlink", path, NULL, &inject);
  REAL (UnlinkAtFn, "unlinkat");

  if (inject)
    return inject_failure (index);
  return end_call (index, real_fn (dirfd, path, flags));
}

void
trb_fault_arm (void)
{
  armed = 1;
}

void
trb_fault_disarm (void)
{
  armed = 0;
}

/* One line per call, fields split by tabs:
 *   call <n> <name> <injected 0|1> <failed 0|1> <errno name or 0> <path> [<new path>] */
void
trb_fault_report (FILE *out)
{
  for (int i = 0; i < n_calls; i++)
    {
      const Call *c = &calls[i];
      const char *err = c->err == 0 ? "0" : c->err == EIO ? "EIO" : c->err == ENOSPC ?
                        "ENOSPC" : c->err == EDQUOT ? "EDQUOT" : strerror (c->err);

      fprintf (out, "call\t%d\t%s\t%d\t%d\t%s\t%s", i + 1, c->name, c->injected, c->failed, err,
               c->path != NULL ? c->path : "");
      if (c->path2 != NULL)
        fprintf (out, "\t%s", c->path2);
      fputc ('\n', out);
    }
}
