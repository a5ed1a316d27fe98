import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function SettingsPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Settings</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Settings</h1>
        </main>
      </IonContent>
    </IonPage>
  );
}
