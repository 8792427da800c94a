export type { MailBody } from './layout';
export type { OrderMailData, OrderMailLine, OrderMailSetup } from './order-mail-data';
export { orderConfirmationMail } from './order-confirmation-mail';
export { paymentFailedMail } from './payment-failed-mail';
export { orderCancelledMail } from './order-cancelled-mail';
export { refundMail } from './refund-mail';
export { shippedMail } from './shipped-mail';
export { passwordResetMail, type PasswordResetMailData } from './password-reset-mail';
export { exchangeMail, type ExchangeMailData, type ExchangeMailStep } from './exchange-mail';
