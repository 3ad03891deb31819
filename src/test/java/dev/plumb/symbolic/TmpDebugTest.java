package dev.plumb.symbolic;
import org.junit.jupiter.api.Test;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.*;
class TmpDebugTest {
  @Test void t() {
    Symja s = new Symja(5);
    ISymbol k = F.Dummy("pb001"), p0 = F.Dummy("pb002"), g = F.Dummy("pb003"), z = F.Dummy("pb004");
    IExpr e = s.eval(F.Times(F.QQ(1,25), F.Power(F.C5, F.CN1D2), k, F.Power(F.Plus(F.Times(F.C5, F.Power(F.Divide(p0, k), F.QQ(2,5))), F.Times(F.CN2, g, z, F.Power(k, F.CN1))), F.QQ(5,2))));
    System.out.println("E " + e + " " + e.isTimes());
    for (IExpr c : new Tidy(s, z).candidates(e)) System.out.println("C " + c + " -> " + s.eval(c));
    IExpr r = s.eval(F.Times(F.Sqrt(F.C3), F.Sqrt(p0), F.Power(g, F.CN1D2), F.Power(k, F.CN1), F.Power(F.Times(F.C2, F.Pi), F.CN1D2)));
    System.out.println("R " + r);
    for (IExpr c : new Tidy(s, z).candidates(r)) System.out.println("C " + c + " -> " + s.eval(c));
  }
}
