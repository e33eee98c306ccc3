/**
 * Importing this file registers every area's part of the demo scenario, in order.
 * Each area adds one import line here.
 */
// Recipients and sites first: pledges and blankets refer to them.
import './recipients';

export {};
import './volunteering';
// Opening hours and the demo's bookings: after the blankets they book.
import './drop-offs';
// Assignments after the blankets they place.
import './assignments';
// Delivery runs take the assigned, packed and delivered blankets the steps above made.
import './delivery';
// Makers who asked to be thanked when their blankets are delivered.
import './thank-you';
// Photos last: they picture the blankets the steps above made.
import './photos';
// A message the mail server refused, for the Mail page's list of what is not sent yet.
import './mail';
