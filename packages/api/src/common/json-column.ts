import { DataType } from 'sequelize-typescript';
import type { ModelAttributeColumnOptions } from 'sequelize';

/** A TEXT column holding JSON, read back parsed (`fallback` when the cell is NULL). */
export function jsonColumn<T>(
  name: string,
  fallback: T,
  allowNull = false,
): Partial<ModelAttributeColumnOptions> {
  return {
    type: DataType.TEXT,
    allowNull,
    get(this: { getDataValue(key: string): unknown }) {
      const raw = this.getDataValue(name);
      return typeof raw === 'string' ? (JSON.parse(raw) as T) : fallback;
    },
    set(this: { setDataValue(key: string, value: unknown): void }, value: unknown) {
      this.setDataValue(name, value === null || value === undefined ? null : JSON.stringify(value));
    },
  };
}
