import { DataTypes, type Model } from 'sequelize';

/**
 * An e-mail column stored trimmed and lower-cased whatever path writes it, so every lookup is
 * a plain equality that behaves the same on SQLite and PostgreSQL (PostgreSQL compares text
 * case-sensitively; the API lower-cases input at the edge too, see emailField).
 */
export function emailAttribute(options: { unique?: boolean } = {}) {
  return {
    type: DataTypes.STRING(254),
    allowNull: false,
    ...(options.unique ? { unique: true } : {}),
    set(this: Model, value: unknown) {
      this.setDataValue('email', typeof value === 'string' ? value.trim().toLowerCase() : value);
    },
  };
}
