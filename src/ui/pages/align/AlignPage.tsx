import { IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';

export function AlignPage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Align</IonTitle>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding">
        <main>
          <h1 className="gm-label">Align</h1>
          <p>Live guidance to set the planned azimuth, tilt and roll with the phone lying on the base plate, with true north from the magnetic model, the sun, or a reference bearing.</p>
        </main>
      </IonContent>
    </IonPage>
  );
}
