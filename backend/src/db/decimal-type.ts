// The numeric(19,4) column as an exact Decimal in code and a plain decimal string towards PostgreSQL.
import { Type, type Platform, type EntityProperty } from '@mikro-orm/core';
import { Decimal, toDecimal, toWire } from '../../../shared/money';

export class DecimalType extends Type<Decimal | null, string | null> {
  override convertToDatabaseValue(value: Decimal | string | null | undefined): string | null {
    if (value === null || value === undefined) return null;
    return toWire(typeof value === 'string' ? toDecimal(value) : value, 4);
  }

  override convertToJSValue(value: Decimal | string | null | undefined): Decimal | null {
    if (value === null || value === undefined) return null;
    return typeof value === 'string' ? toDecimal(value) : value;
  }

  override compareAsType(): string {
    return 'string';
  }

  override getColumnType(_prop: EntityProperty, _platform: Platform): string {
    return 'numeric(19,4)';
  }
}
