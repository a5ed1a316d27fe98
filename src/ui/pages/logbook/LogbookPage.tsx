import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function LogbookPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Logbook</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Logbook</h1>
          <p>Sites, reflectors, installations and inspections stored on this device, with history, photos, export and backup.</p>
        </main>
      </IonContent>
    </IonPage>
  );
}
