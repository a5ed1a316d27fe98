import { createRoot } from 'react-dom/client';
import { App } from './ui/App.tsx';
import { registerOfflineCache } from './ui/offline.ts';
import { startApp } from './ui/startup.ts';

registerOfflineCache();
void startApp().finally(() => createRoot(document.getElementById('root')!).render(<App />));
