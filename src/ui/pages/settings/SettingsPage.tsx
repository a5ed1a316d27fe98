/** Settings: preferences, storage, backup (download, restore, merge), open merge conflicts, exchange (exports, site import), demo data. */
import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { useCallback, useState } from 'react';
import { BackupReminder } from './BackupReminder.tsx';
import { BackupSection } from './BackupSection.tsx';
import { ConflictsSection } from './ConflictsSection.tsx';
import { DemoSection } from './DemoSection.tsx';
import { DeletedRecords } from '../logbook/DeletedRecords.tsx';
import { ExchangeSection } from './ExchangeSection.tsx';
import { PreferencesSection } from './PreferencesSection.tsx';
import { StorageSection } from './StorageSection.tsx';
import { SyncSection } from './SyncSection.tsx';
import './settings.css';

export function SettingsPage() {
  const [refreshKey, setRefreshKey] = useState(0);
  const changed = useCallback(() => setRefreshKey((n) => n + 1), []);
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Settings</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Settings and data</h1>
          <p data-testid="privacy">
            Nothing leaves this phone unless you export or share it, or sign in to your team’s register below. Glintmark sends your records nowhere else.
          </p>
          <BackupReminder onSaved={changed} refreshKey={refreshKey} />
          <PreferencesSection />
          <StorageSection refreshKey={refreshKey} />
          <BackupSection onChanged={changed} />
          <SyncSection />
          <ConflictsSection />
          <DeletedRecords />
          <ExchangeSection onChanged={changed} />
          <DemoSection onChanged={changed} />
        </main>
      </IonContent>
    </IonPage>
  );
}
