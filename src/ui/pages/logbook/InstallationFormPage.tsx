/**
 * `/logbook/new-installation` (from the Align capture and the plan) and `/logbook/installation/:installationId`
 * (a stored one). A new form starts afresh when the crew comes back after saving one.
 */
import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar, useIonViewWillEnter } from '@ionic/react';
import { useRef, useState } from 'react';
import { useParams } from 'react-router-dom';
import { EditInstallation } from './EditInstallation.tsx';
import { NewInstallation } from './NewInstallation.tsx';
import './logbook.css';

export function InstallationFormPage() {
  const { installationId } = useParams<{ installationId?: string }>();
  const [session, setSession] = useState(0);
  const savedRef = useRef(false);
  useIonViewWillEnter(() => {
    if (!savedRef.current) return;
    savedRef.current = false;
    setSession((s) => s + 1);
  });
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>{installationId ? 'Installation' : 'New installation'}</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          {installationId ? (
            <EditInstallation key={installationId} id={installationId} />
          ) : (
            <>
              <h1 className="gm-label">Record the installation</h1>
              <NewInstallation key={session} onSaved={() => (savedRef.current = true)} />
            </>
          )}
        </main>
      </IonContent>
    </IonPage>
  );
}
