package dev.plumb.units;

import java.util.Map;
import javax.measure.IncommensurableException;
import javax.measure.UnconvertibleException;
import tech.units.indriya.unit.UnitDimension;

/**
 * Reads the scale factor and the dimension off a JSR 385 unit, so that plumb's units take
 * their conversion factors from Indriya's exact rational converters.
 */
final class IndriyaUnits {
  private IndriyaUnits() {}

  /** A plumb unit written {@code text} with the factor and dimension of {@code jsr}. */
  static Unit toUnit(String text, javax.measure.Unit<?> jsr) {
    return new Unit(text, factor(jsr), dimension(jsr));
  }

  /** How many coherent SI base units one {@code jsr} is. */
  static double factor(javax.measure.Unit<?> jsr) {
    try {
      return jsr.getConverterToAny(jsr.getSystemUnit()).convert(1.0);
    } catch (IncommensurableException | UnconvertibleException e) {
      // Every unit is commensurable with its own system unit; failing here is a catalog bug.
      throw new IllegalStateException("cannot convert " + jsr + " to " + jsr.getSystemUnit(), e);
    }
  }

  static Dimension dimension(javax.measure.Unit<?> jsr) {
    javax.measure.Dimension d = jsr.getDimension();
    Map<? extends javax.measure.Dimension, Integer> parts = d.getBaseDimensions();
    if (parts == null) {
      return Dimension.of(base(d));
    }
    Dimension result = Dimension.NONE;
    for (Map.Entry<? extends javax.measure.Dimension, Integer> e : parts.entrySet()) {
      result = result.mul(Dimension.of(base(e.getKey()), Rational.of(e.getValue())));
    }
    return result;
  }

  private static Dimension.Base base(javax.measure.Dimension d) {
    if (d.equals(UnitDimension.LENGTH)) {
      return Dimension.Base.LENGTH;
    } else if (d.equals(UnitDimension.MASS)) {
      return Dimension.Base.MASS;
    } else if (d.equals(UnitDimension.TIME)) {
      return Dimension.Base.TIME;
    } else if (d.equals(UnitDimension.ELECTRIC_CURRENT)) {
      return Dimension.Base.CURRENT;
    } else if (d.equals(UnitDimension.TEMPERATURE)) {
      return Dimension.Base.TEMPERATURE;
    } else if (d.equals(UnitDimension.AMOUNT_OF_SUBSTANCE)) {
      return Dimension.Base.AMOUNT;
    } else if (d.equals(UnitDimension.LUMINOUS_INTENSITY)) {
      return Dimension.Base.LUMINOUS;
    }
    throw new IllegalStateException("not an SI base dimension: " + d);
  }
}
