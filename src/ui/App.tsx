import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
import '@ionic/react/css/padding.css';
import './theme/theme.css';

import { IonApp, IonIcon, IonLabel, IonRouterOutlet, IonTabBar, IonTabButton, IonTabs, setupIonicReact } from '@ionic/react';
import { IonReactRouter } from '@ionic/react-router';
import { Redirect, Route } from 'react-router-dom';
import { TABS } from './tabs.ts';
import { AutoSync } from './components/AutoSync.tsx';
import { DemoOffer } from './components/DemoOffer.tsx';
import { FirstRunSafety } from './components/FirstRunSafety.tsx';
import { StartupBanner } from './components/StartupBanner.tsx';
import { applyTheme } from './state/theme.ts';
import { PlanPage } from './pages/plan/PlanPage.tsx';
import { lazy, Suspense, type ComponentType } from 'react';
import { ErrorBoundary } from './components/ErrorBoundary.tsx';
import { UpdateNotice } from './components/UpdateNotice.tsx';

// Only the Plan screen is in the first bundle; the other tabs load on first visit (and are precached for offline use).
const page = (load: () => Promise<Record<string, ComponentType>>, name: string) =>
  lazy(async () => ({ default: (await load())[name] }));
const PassesPage = page(() => import('./pages/passes/PassesPage.tsx'), 'PassesPage');
const AlignPage = page(() => import('./pages/align/AlignPage.tsx'), 'AlignPage');
const LogbookPage = page(() => import('./pages/logbook/LogbookPage.tsx'), 'LogbookPage');
const SitePage = page(() => import('./pages/logbook/SitePage.tsx'), 'SitePage');
const InstallationFormPage = page(() => import('./pages/logbook/InstallationFormPage.tsx'), 'InstallationFormPage');
const InspectionFormPage = page(() => import('./pages/logbook/InspectionFormPage.tsx'), 'InspectionFormPage');
const SettingsPage = page(() => import('./pages/settings/SettingsPage.tsx'), 'SettingsPage');
const RegisterPage = page(() => import('./pages/register/RegisterPage.tsx'), 'RegisterPage');
// Each lazily loaded screen has its own error boundary: a chunk that fails to load or a screen that throws shows a
// message there, and the tab bar stays usable.
const lazyRoute = (C: ComponentType) => () => (
  <ErrorBoundary where="screen">
    <Suspense fallback={<Loading />}>
      <C />
    </Suspense>
  </ErrorBoundary>
);

const Loading = () => <p className="ion-padding">Loading…</p>;

setupIonicReact({ mode: 'md', animated: false });
applyTheme();

export function App() {
  return (
    <ErrorBoundary where="app">
    <IonApp>
      <StartupBanner />
      <FirstRunSafety />
      <DemoOffer />
      <AutoSync />
      <IonReactRouter>
        <UpdateNotice />
        <IonTabs>
          <IonRouterOutlet>
            <Route exact path="/plan" render={() => <ErrorBoundary where="screen"><PlanPage /></ErrorBoundary>} />
            <Route exact path="/passes" render={lazyRoute(PassesPage)} />
            <Route exact path="/align" render={lazyRoute(AlignPage)} />
            <Route exact path="/logbook" render={lazyRoute(LogbookPage)} />
            <Route exact path="/logbook/site/:siteId" render={lazyRoute(SitePage)} />
            <Route exact path="/logbook/new-installation" render={lazyRoute(InstallationFormPage)} />
            <Route exact path="/logbook/installation/:installationId" render={lazyRoute(InstallationFormPage)} />
            <Route exact path="/logbook/inspection/new/:reflectorId" render={lazyRoute(InspectionFormPage)} />
            <Route exact path="/logbook/inspection/:inspectionId" render={lazyRoute(InspectionFormPage)} />
            <Route exact path="/settings" render={lazyRoute(SettingsPage)} />
            <Route exact path="/register" render={lazyRoute(RegisterPage)} />
            <Route exact path="/">
              <Redirect to="/plan" />
            </Route>
          </IonRouterOutlet>
          <IonTabBar slot="bottom">
            {TABS.map((t) => (
              <IonTabButton key={t.path} tab={t.tab} href={t.path} data-testid={`tab-${t.tab}`}>
                <IonIcon aria-hidden="true" icon={t.icon} />
                <IonLabel>{t.label}</IonLabel>
              </IonTabButton>
            ))}
          </IonTabBar>
        </IonTabs>
      </IonReactRouter>
    </IonApp>
    </ErrorBoundary>
  );
}
