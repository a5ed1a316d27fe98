import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function InstallationFormPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Installation</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Installation</h1>
        </main>
      </IonContent>
    </IonPage>
  );
}
