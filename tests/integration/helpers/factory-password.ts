/** The password of every user the integration factories make (hashed at bcrypt cost 4 there). */
export const factoryPassword = "factory-password-1";
