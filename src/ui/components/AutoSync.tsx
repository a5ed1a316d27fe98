/** Starts the background sync with the team register (does nothing until a register is signed in). Renders nothing. */
import { useEffect } from 'react';
import { useGlintmarkDb } from '../../data/index.ts';
import { startAutoSync } from '../../sync/index.ts';

export function AutoSync() {
  const db = useGlintmarkDb();
  useEffect(() => startAutoSync(db), [db]);
  return null;
}
