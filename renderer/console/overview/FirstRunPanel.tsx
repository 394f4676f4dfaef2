import { useEffect, useState } from 'react';
import type { FirstRunTask } from '../../../app/contract';
import { useHost, useHostQuery } from '../host-context';

export function FirstRunPanel() {
  const { api } = useHost();
  const initial = useHostQuery((host) => host.getFirstRunStatus({}));
  const [tasks, setTasks] = useState<Map<string, FirstRunTask>>(new Map());

  useEffect(() => {
    if (initial?.ok) setTasks(new Map(initial.value.tasks.map((task) => [task.id, task])));
  }, [initial]);
  useEffect(
    () => api.onFirstRunProgress((task) => setTasks((previous) => new Map(previous).set(task.id, task))),
    [api],
  );

  return (
    <section className="panel" aria-labelledby="first-run-heading">
      <h2 id="first-run-heading">Setting up</h2>
      {tasks.size === 0 && <p className="muted">Nothing to set up.</p>}
      <ul className="tasks">
        {[...tasks.values()].map((task) => (
          <li key={task.id} className={`task task-${task.state}`}>
            <span className="task-label">{task.label}</span>
            <progress max={1} value={task.progress} aria-label={`${task.label} progress`} />
            <span className="task-message">{task.message}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
