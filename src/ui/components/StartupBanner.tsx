/** A banner when the logbook did not open at start-up (e.g. written by a newer Glintmark): says why in words. */
import { useSyncExternalStore } from 'react';
import { startupProblem, subscribeStartupProblem } from '../startup.ts';

export function StartupBanner() {
  const problem = useSyncExternalStore(subscribeStartupProblem, startupProblem);
  if (!problem) return null;
  return (
    <div role="alert" className="ion-padding gm-warn" data-testid="startup-problem">
      {problem}
    </div>
  );
}
