/*
 * Power-cut model for the durability test, loaded into the writer with LD_PRELOAD.
 *
 * A power cut keeps what reached the disk through fsync/fdatasync and loses what was only in
 * the page cache. This shim records exactly that: each time the process syncs a regular file
 * under RIGBOOK_DURABLE_DIR, it copies the file's whole content, as it stands at that
 * moment, to "<file>.durable" (written beside it, then renamed), and then syncs for real. After
 * the writer is killed, the ".durable" copies are the store as the disk would hold it after the
 * power came back: writes never synced are not in them, however long they sat in the cache.
 */
#define _GNU_SOURCE
#include <dlfcn.h>
#include <fcntl.h>
#include <limits.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

static void record_durable(int fd) {
  const char *dir = getenv("RIGBOOK_DURABLE_DIR");
  if (!dir || !*dir) return;
  struct stat st;
  if (fstat(fd, &st) != 0 || !S_ISREG(st.st_mode)) return;
  char link[64], path[PATH_MAX];
  snprintf(link, sizeof link, "/proc/self/fd/%d", fd);
  ssize_t n = readlink(link, path, sizeof path - 1);
  if (n <= 0) return;
  path[n] = '\0';
  if (strncmp(path, dir, strlen(dir)) != 0) return;
  char tmp[PATH_MAX + 32], out[PATH_MAX + 32];
  snprintf(tmp, sizeof tmp, "%s.durable-tmp", path);
  snprintf(out, sizeof out, "%s.durable", path);
  int w = open(tmp, O_WRONLY | O_CREAT | O_TRUNC, 0644);
  if (w < 0) return;
  char buf[65536];
  off_t off = 0;
  for (;;) {
    ssize_t r = pread(fd, buf, sizeof buf, off);
    if (r <= 0) break;
    if (write(w, buf, (size_t)r) != r) break;
    off += r;
  }
  close(w);
  rename(tmp, out);
}

int fsync(int fd) {
  static int (*real)(int) = NULL;
  if (!real) real = (int (*)(int))dlsym(RTLD_NEXT, "fsync");
  record_durable(fd);
  return real(fd);
}

int fdatasync(int fd) {
  static int (*real)(int) = NULL;
  if (!real) real = (int (*)(int))dlsym(RTLD_NEXT, "fdatasync");
  record_durable(fd);
  return real(fd);
}
