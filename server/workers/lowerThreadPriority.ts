import { setPriority } from 'node:os'
import { isMainThread } from 'node:worker_threads'

/**
 * Runs a worker thread at a lower CPU priority (nice 10) than the request thread, so that
 * health checks and pages are answered promptly while every core measures or renders. On
 * Linux setpriority(2) with pid 0 changes the calling thread only, not the process. On the
 * main thread (the in-thread development fallback) and where it is not permitted, nothing
 * changes.
 */
export function lowerThreadPriority(niceness = 10): boolean {
  if (isMainThread) return false
  try {
    setPriority(niceness)
    return true
  }
  catch {
    return false
  }
}
