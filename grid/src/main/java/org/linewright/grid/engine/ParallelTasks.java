package org.linewright.grid.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;

/**
 * Runs an engine's tasks on its pool and gives back their results in task order (so the caller reduces them in a
 * fixed order, whatever the thread count). A task's unchecked exception or error reaches the caller as itself,
 * not wrapped; an interrupt restores the thread's flag and ends the computation.
 */
public final class ParallelTasks {
    private ParallelTasks() {
    }

    /**
     * @param what what the tasks compute, for the message when interrupted
     * @return each task's result, in the order of {@code tasks}
     */
    public static <T> List<T> invokeAll(ExecutorService pool, List<? extends Callable<T>> tasks, String what) {
        try {
            List<Future<T>> futures = pool.invokeAll(tasks);
            List<T> results = new ArrayList<>(futures.size());
            for (Future<T> f : futures) {
                results.add(f.get());
            }
            return results;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while " + what, e);
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            if (cause instanceof RuntimeException re) {
                throw re;
            }
            if (cause instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(cause);
        }
    }
}
