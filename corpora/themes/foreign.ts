/**
 * Invented messages from customers abroad, in German, Spanish and French. They carry the same
 * themes as the English ones, so a router trained on the demo meets words it has rarely seen.
 */
import type { Courtesies, ForeignBank, Language } from '../api.js';

/** Greetings and sign-offs per language other than English. */
export const FOREIGN_COURTESIES: Readonly<Record<Exclude<Language, 'en'>, Courtesies>> = {
  de: {
    openers: ['Guten Tag,', 'Hallo,', 'Sehr geehrte Damen und Herren,', 'Liebes Marrowgate-Team,'],
    closers: ['Mit freundlichen Grüßen', 'Viele Grüße', 'Danke und beste Grüße'],
  },
  es: {
    openers: ['Hola,', 'Buenos días,', 'Estimados señores:'],
    closers: ['Un saludo,', 'Muchas gracias,', 'Saludos cordiales,'],
  },
  fr: {
    openers: ['Bonjour,', 'Madame, Monsieur,', "Bonjour à toute l'équipe,"],
    closers: ['Cordialement,', 'Bien à vous,', "Merci d'avance,"],
  },
};

/** Foreign-language phrase banks; labels match the English themes. */
export const FOREIGN_BANKS: readonly ForeignBank[] = [
  {
    label: 'Late delivery', language: 'de', size: 4,
    leads: ['Meine Bestellung {order} ist seit {days} Tagen unterwegs und ich habe noch nichts erhalten.',
      'Laut Sendungsverfolgung wurde mein Paket zugestellt, aber bei mir ist nichts angekommen.',
      'Wo bleibt meine Bestellung {order}? Ich warte schon über eine Woche.'],
    details: ['Die Sendungsnummer ist {tracking}.', 'Die Lieferung sollte ein Geschenk sein.',
      'Ich wohne in Österreich, vielleicht dauert der Versand länger?'],
    asks: ['Könnten Sie bitte nachsehen, wo das Paket ist?', 'Bitte geben Sie mir kurz Bescheid.',
      'Falls es verloren gegangen ist, hätte ich gern Ersatz oder mein Geld zurück.'],
  },
  {
    label: 'Refunds and returns', language: 'de', size: 3,
    leads: ['Ich möchte den Artikel {product} aus Bestellung {order} zurückschicken.',
      'Ich habe die Ware vor {days} Tagen zurückgesendet, aber noch keine Erstattung erhalten.',
      'Bitte stornieren Sie meine Bestellung {order}.'],
    details: ['Der Artikel ist unbenutzt und originalverpackt.', 'Ich habe {amount} bezahlt.',
      'Die Rücksendung ging mit {courier}, Sendungsnummer {tracking}.'],
    asks: ['Bitte erstatten Sie mir den Betrag auf meine Karte.', 'Wie bekomme ich ein Rücksendeetikett?'],
  },
  {
    label: 'Arrived damaged', language: 'de', size: 3,
    leads: ['Leider ist der Artikel {product} zerbrochen bei mir angekommen.',
      'Der Deckel der Teekanne war bei der Lieferung gesprungen.',
      'Zwei Tassen aus Bestellung {order} haben Risse.'],
    details: ['Fotos vom Karton und von den Scherben habe ich angehängt.', 'Der Karton war außen stark eingedrückt.',
      'Die Verpackung war leider sehr dünn.'],
    asks: ['Können Sie mir bitte Ersatz schicken?', 'Muss ich die Scherben zurückschicken?'],
  },
  {
    label: 'Product questions', language: 'de', size: 2,
    leads: ['Ist der Artikel {product} spülmaschinenfest?', 'Wann ist der Artikel {product} wieder lieferbar?',
      'Liefern Sie auch nach Österreich?'],
    details: ['Ich möchte ihn gern verschenken.', 'Auf der Website finde ich keine Maße.'],
    asks: ['Vielen Dank im Voraus für Ihre Antwort.'],
  },
  {
    label: 'Late delivery', language: 'es', size: 3,
    leads: ['Hice un pedido ({order}) hace {days} días y todavía no ha llegado.',
      'El seguimiento dice que el paquete fue entregado, pero no lo he recibido.',
      '¿Dónde está mi pedido {order}? Llevo más de una semana esperando.'],
    details: ['El número de seguimiento es {tracking}.', 'Era un regalo de cumpleaños para mi madre.'],
    asks: ['¿Podrían averiguar qué ha pasado con el paquete?',
      'Si se ha perdido, les agradecería que me enviaran otro.'],
  },
  {
    label: 'Refunds and returns', language: 'es', size: 3,
    leads: ['Quisiera devolver el artículo {product} de mi pedido {order}.',
      'Devolví el artículo hace {days} días y aún no he recibido el reembolso.',
      'Por favor, cancelen mi pedido {order}, me equivoqué al hacerlo.'],
    details: ['El artículo está sin usar y en su caja original.', 'Pagué {amount} con tarjeta.'],
    asks: ['¿Me pueden enviar una etiqueta de devolución?', 'Por favor, devuélvanme el dinero a la misma tarjeta.'],
  },
  {
    label: 'Product questions', language: 'es', size: 3,
    leads: ['¿El artículo {product} se puede meter en el lavavajillas?', '¿Hacen envíos a España?',
      '¿Qué té me recomiendan para alguien que no toma cafeína?'],
    details: ['Es para un regalo de cumpleaños.', 'No encuentro las medidas en la página web.'],
    asks: ['Gracias de antemano.', 'Quedo a la espera de su respuesta.'],
  },
  {
    label: 'Praise', language: 'es', size: 2,
    leads: ['Solo quería daros las gracias: el artículo {product} es precioso.',
      'El té {tea} está buenísimo, ya se lo he recomendado a mis amigas.'],
    details: ['Llegó muy bien embalado y antes de lo previsto.', 'Se nota que cada pieza está hecha a mano.'],
    asks: ['¡Volveré a comprar seguro!', 'Enhorabuena por vuestro trabajo.'],
  },
  {
    label: 'Late delivery', language: 'fr', size: 3,
    leads: ["J'ai commandé l'article {product} il y a {days} jours et je n'ai toujours rien reçu.",
      "Le suivi de ma commande {order} n'a pas bougé depuis une semaine.",
      "Le transporteur indique que le colis a été livré, mais je ne l'ai jamais reçu."],
    details: ['Mon numéro de suivi est le {tracking}.', "C'était un cadeau d'anniversaire."],
    asks: ['Pourriez-vous vérifier où se trouve mon colis ?', 'Merci de me tenir au courant.'],
  },
  {
    label: 'Arrived damaged', language: 'fr', size: 2,
    leads: ["L'article {product} est arrivé cassé.", 'Deux tasses de la commande {order} sont ébréchées.'],
    details: ['Je vous joins des photos du carton et des morceaux.', "Le carton était écrasé à l'arrivée."],
    asks: ["Pouvez-vous m'envoyer un remplacement ?", 'Dois-je vous renvoyer les morceaux ?'],
  },
  {
    label: 'Workshop bookings', language: 'fr', size: 3,
    leads: ["Je voudrais réserver deux places pour l'atelier {workshop}.",
      'Est-il possible de déplacer ma réservation à une autre date ?',
      "Je dois malheureusement annuler ma place à l'atelier."],
    details: ['Ma référence de réservation est {order}.', 'Nous sommes débutantes toutes les deux.',
      'Nous serons en vacances dans la région en août.'],
    asks: ['Merci de me confirmer les dates disponibles.', 'Pouvez-vous me confirmer la réservation par e-mail ?'],
  },
  {
    label: 'Praise', language: 'fr', size: 2,
    leads: ["Un grand merci pour l'atelier, nous avons passé un moment merveilleux.",
      "L'article {product} est encore plus beau en vrai que sur les photos."],
    details: ["{staff} a été d'une patience incroyable.", 'Le colis était magnifiquement emballé.'],
    asks: ['À bientôt !', "Bravo à toute l'équipe."],
  },
  {
    label: 'Refunds and returns', language: 'fr', size: 2,
    leads: ["Je souhaite retourner l'article {product} de ma commande {order}.",
      "J'ai renvoyé l'article il y a {days} jours et je n'ai pas encore été remboursée."],
    details: ["L'article n'a jamais été utilisé.", "J'ai payé {amount} par carte."],
    asks: ['Merci de procéder au remboursement.', "Pourriez-vous m'envoyer une étiquette de retour ?"],
  },
];
