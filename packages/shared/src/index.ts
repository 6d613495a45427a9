export * from './auth/auth.schemas';
export * from './facility/facility.schemas';
export * from './time/zoned-time';
export * from './bookings/booking.schemas';
export * from './bookings/booking-policy';
export * from './usage/usage.schemas';
export * from './engine';
export * from './billing/billing.schemas';
