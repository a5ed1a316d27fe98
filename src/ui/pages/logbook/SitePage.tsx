import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function SitePage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Site</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Site</h1>
        </main>
      </IonContent>
    </IonPage>
  );
}
