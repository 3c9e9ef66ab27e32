#!/usr/bin/env bash
# Regenerates the double-precision kernel classes (Double*.java) from the float ones (Float*.java)
# in solver/.../kernel, so the two paths stay the same code. Edit the Float* files, run this,
# then build and run the tests. Needs sed and python3.
set -euo pipefail
cd "$(dirname "$0")/../solver/src/main/java/org/evanesce/solver/kernel"
for f in FloatKernels FloatStrip FloatS FloatP; do g=${f/Float/Double}; sed -e 's/FloatVector/DoubleVector/g; s/VectorMask<Float>/VectorMask<Double>/g; s/VectorSpecies<Float>/VectorSpecies<Double>/g; s/floatSpecies/doubleSpecies/g; s/FloatKernels/DoubleKernels/g; s/FloatStrip/DoubleStrip/g; s/FloatS\b/DoubleS/g; s/FloatP\b/DoubleP/g; s/\bfloat\b/double/g; s/1e-30f/1e-300/g; s/\([0-9]\)f\b/\1.0/g; s/(double) courant/courant/g; s/toFloat/toDouble/g; s/Float\.BYTES/Double.BYTES/g; s/Single-precision/Double-precision/; s/in single precision/in double precision/; s/\* 4 \* nx/* 8 * nx/; s/\(return .*\) \* 4;/\1 * 8;/' $f.java > $g.java; done
sed -i 's/{@link DoubleKernels} is the same$/{@link FloatKernels} is the same/; s/^ \* code in double precision; change both together./ * code in single precision; change both together./' DoubleKernels.java
sed -i 's/{@link DoubleP} is the same in$/{@link FloatP} is the same in/; s/^ \* double; change both together./ * single precision; change both together./' DoubleP.java
sed -i 's/{@link DoubleS} is the same in double;/{@link FloatS} is the same in single precision;/' DoubleS.java
sed -i 's/8 orders above the subnormal range/8 orders above the subnormal range (about 2.2e-308)/' DoubleKernels.java
sed -i 's/(double) //g' DoubleS.java DoubleP.java DoubleStrip.java DoubleKernels.java
python3 - <<'PY'
import re
s=open('DoubleS.java').read()
s=re.sub(r'toDouble\((c\[[01]\])\)',r'\1',s)
s=re.sub(r'\n    static double\[\] toDouble\(double\[\] a\) \{.*?\n    \}\n','\n',s,flags=re.S)
open('DoubleS.java','w').write(s)
p=open('DoubleP.java').read()
p=re.sub(r'DoubleS\.toDouble\((c[xy]\[[01]\])\)',r'\1',p)
open('DoubleP.java','w').write(p)
t=open('DoubleStrip.java').read()
t=re.sub(r'toDouble\((p\.\w+)\)',r'\1.clone()',t)
t=re.sub(r'\n    private static double\[\] toDouble\(double\[\] a\) \{.*?\n    \}\n','\n',t,flags=re.S)
open('DoubleStrip.java','w').write(t)
PY
