import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function InspectionFormPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Inspection</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Inspection</h1>
        </main>
      </IonContent>
    </IonPage>
  );
}
