import { createRoot } from 'react-dom/client';
import { App } from './ui/App.tsx';
import { registerOfflineCache } from './ui/offline.ts';
import { startApp } from './ui/startup.ts';

registerOfflineCache();
// The Plan screen is shown at once; the logbook opens and the saved task is put back in the background.
createRoot(document.getElementById('root')!).render(<App />);
void startApp();
