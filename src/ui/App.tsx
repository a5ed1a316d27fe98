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
import { PlanPage } from './pages/plan/PlanPage.tsx';
import { PassesPage } from './pages/passes/PassesPage.tsx';
import { AlignPage } from './pages/align/AlignPage.tsx';
import { LogbookPage } from './pages/logbook/LogbookPage.tsx';

setupIonicReact({ mode: 'md', animated: false });

export function App() {
  return (
    <IonApp>
      <IonReactRouter>
        <IonTabs>
          <IonRouterOutlet>
            <Route exact path="/plan" component={PlanPage} />
            <Route exact path="/passes" component={PassesPage} />
            <Route exact path="/align" component={AlignPage} />
            <Route path="/logbook" component={LogbookPage} />
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
  );
}
