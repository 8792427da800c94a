/** Most of one product a cart line or an order may hold (plain module: the client imports it without the DTO decorators). */
export const maxLineQuantity = 20;
