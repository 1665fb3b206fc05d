;; Off-axis loop field for many points, two at a time (WebAssembly SIMD, f64x2).
;; The same operations in the same order as loopFieldBulk in loop-field.ts (IEEE-754
;; arithmetic and correctly rounded sqrt in both, no fused multiply-add in either), so the
;; two give the same bits; change them together. Formula and sources: loopFieldBulk.
;;
;; Built into loop-field-kernel.ts by `npm run build:kernel` (wabt's wat2wasm); a unit test
;; rebuilds it and compares the bytes.
;;
;; field(n, a, scale, limit, bulk) → i32: n points (even; the caller pads), a = loop
;; radius (m), scale = μ0·NI (T·m), limit = paraxialLimit, bulk = bulkParameterLimit.
;; Memory: z at byte 0, ρ at 16384, B_z written at 32768 and B_ρ at 49152 (2048 points
;; each). Returns 1 if any point lies outside the bulk (m > bulk, paraxial or on the axis):
;; the caller recomputes those points with loopField.
(module
  (memory (export "memory") 1)
  (func (export "field") (param $n i32) (param $a f64) (param $scale f64) (param $limit f64) (param $bulk f64) (result i32)
    (local $i i32) (local $end i32) (local $flags v128)
    (local $A v128) (local $fourA v128) (local $twoA v128) (local $aSq v128) (local $twoASq v128)
    (local $S v128) (local $L v128) (local $B v128) (local $half v128)
    (local $z v128) (local $rho v128) (local $r v128) (local $sum v128) (local $diff v128) (local $z2 v128)
    (local $q v128) (local $d v128) (local $a0 v128) (local $g0 v128) (local $s v128) (local $s2 v128)
    (local $twoAR v128) (local $a1 v128) (local $g1 v128) (local $c2 v128) (local $a2 v128) (local $g2 v128)
    (local $c3 v128) (local $a3 v128) (local $g3 v128) (local $c4 v128) (local $a4 v128) (local $a4s v128)
    (local $c4s v128) (local $tail v128) (local $fourM v128) (local $inv v128) (local $aa v128) (local $tt v128)
    (local.set $A (f64x2.splat (local.get $a)))
    (local.set $fourA (f64x2.splat (f64.mul (f64.const 4) (local.get $a))))
    (local.set $twoA (f64x2.splat (f64.mul (f64.const 2) (local.get $a))))
    (local.set $aSq (f64x2.splat (f64.mul (local.get $a) (local.get $a))))
    (local.set $twoASq (f64x2.splat (f64.mul (f64.const 2) (f64.mul (local.get $a) (local.get $a)))))
    (local.set $S (f64x2.splat (local.get $scale)))
    (local.set $L (f64x2.splat (local.get $limit)))
    (local.set $B (f64x2.splat (local.get $bulk)))
    (local.set $half (f64x2.splat (f64.const 0.5)))
    (local.set $flags (v128.const i64x2 0 0))
    (local.set $end (i32.shl (local.get $n) (i32.const 3)))
    (block $done
      (loop $next
        (br_if $done (i32.ge_u (local.get $i) (local.get $end)))
        (local.set $z (v128.load (local.get $i)))
        (local.set $rho (v128.load offset=16384 (local.get $i)))
        (local.set $r (f64x2.abs (local.get $rho)))
        (local.set $sum (f64x2.add (local.get $A) (local.get $r)))
        (local.set $diff (f64x2.sub (local.get $A) (local.get $r)))
        (local.set $z2 (f64x2.mul (local.get $z) (local.get $z)))
        (local.set $q (f64x2.add (f64x2.mul (local.get $sum) (local.get $sum)) (local.get $z2)))
        (local.set $d (f64x2.add (f64x2.mul (local.get $diff) (local.get $diff)) (local.get $z2)))
        (local.set $a0 (f64x2.sqrt (local.get $q)))
        (local.set $g0 (f64x2.sqrt (local.get $d)))
        (local.set $s (f64x2.add (local.get $a0) (local.get $g0)))
        (local.set $s2 (f64x2.mul (local.get $s) (local.get $s)))
        (local.set $twoAR (f64x2.mul (local.get $twoA) (local.get $r)))
        (local.set $a1 (f64x2.mul (local.get $half) (local.get $s)))
        (local.set $g1 (f64x2.sqrt (f64x2.mul (local.get $a0) (local.get $g0))))
        (local.set $c2 (f64x2.mul (local.get $half) (f64x2.sub (local.get $a1) (local.get $g1))))
        (local.set $a2 (f64x2.mul (local.get $half) (f64x2.add (local.get $a1) (local.get $g1))))
        (local.set $g2 (f64x2.sqrt (f64x2.mul (local.get $a1) (local.get $g1))))
        (local.set $c3 (f64x2.mul (local.get $half) (f64x2.sub (local.get $a2) (local.get $g2))))
        (local.set $a3 (f64x2.mul (local.get $half) (f64x2.add (local.get $a2) (local.get $g2))))
        (local.set $g3 (f64x2.sqrt (f64x2.mul (local.get $a2) (local.get $g2))))
        (local.set $c4 (f64x2.mul (local.get $half) (f64x2.sub (local.get $a3) (local.get $g3))))
        (local.set $a4 (f64x2.mul (local.get $half) (f64x2.add (local.get $a3) (local.get $g3))))
        (local.set $a4s (f64x2.mul (local.get $a4) (local.get $a4)))
        (local.set $c4s (f64x2.mul (local.get $c4) (local.get $c4)))
        ;; tail = (twoAR*twoAR + ((2*c2)*c2 + (4*c3)*c3 + 8*c4s)*s2)*a4s + (c4s*c4s)*s2
        (local.set $tt (f64x2.mul (local.get $twoAR) (local.get $twoAR)))
        (local.set $tail
          (f64x2.add
            (f64x2.mul
              (f64x2.add (local.get $tt)
                (f64x2.mul
                  (f64x2.add
                    (f64x2.add
                      (f64x2.mul (f64x2.mul (f64x2.splat (f64.const 2)) (local.get $c2)) (local.get $c2))
                      (f64x2.mul (f64x2.mul (f64x2.splat (f64.const 4)) (local.get $c3)) (local.get $c3)))
                    (f64x2.mul (f64x2.splat (f64.const 8)) (local.get $c4s)))
                  (local.get $s2)))
              (local.get $a4s))
            (f64x2.mul (f64x2.mul (local.get $c4s) (local.get $c4s)) (local.get $s2))))
        ;; fourM = ((4*a4s)*a4s - a4s*c4s) - (0.3125*c4s)*c4s
        (local.set $fourM
          (f64x2.sub
            (f64x2.sub
              (f64x2.mul (f64x2.mul (f64x2.splat (f64.const 4)) (local.get $a4s)) (local.get $a4s))
              (f64x2.mul (local.get $a4s) (local.get $c4s)))
            (f64x2.mul (f64x2.mul (f64x2.splat (f64.const 0.3125)) (local.get $c4s)) (local.get $c4s))))
        ;; inverse = (scale*a4) / ((((fourM*d)*q)*r)*s2)
        (local.set $inv
          (f64x2.div
            (f64x2.mul (local.get $S) (local.get $a4))
            (f64x2.mul (f64x2.mul (f64x2.mul (f64x2.mul (local.get $fourM) (local.get $d)) (local.get $q)) (local.get $r)) (local.get $s2))))
        (local.set $aa (f64x2.mul (local.get $diff) (local.get $sum)))
        ;; axial = (inverse*r) * ((((2aSq)*(aa+z2))*a4s)*s2 - (aa-z2)*tail)
        (v128.store offset=32768 (local.get $i)
          (f64x2.mul (f64x2.mul (local.get $inv) (local.get $r))
            (f64x2.sub
              (f64x2.mul (f64x2.mul (f64x2.mul (local.get $twoASq) (f64x2.add (local.get $aa) (local.get $z2))) (local.get $a4s)) (local.get $s2))
              (f64x2.mul (f64x2.sub (local.get $aa) (local.get $z2)) (local.get $tail)))))
        ;; radial = (±inverse*z) * (((tt*a4s)*s2) - ((aSq + r*r) + z2)*tail)
        (v128.store offset=49152 (local.get $i)
          (f64x2.mul
            (f64x2.mul (v128.xor (local.get $inv) (v128.and (local.get $rho) (v128.const i64x2 0x8000000000000000 0x8000000000000000))) (local.get $z))
            (f64x2.sub
              (f64x2.mul (f64x2.mul (local.get $tt) (local.get $a4s)) (local.get $s2))
              (f64x2.mul (f64x2.add (f64x2.add (local.get $aSq) (f64x2.mul (local.get $r) (local.get $r))) (local.get $z2)) (local.get $tail)))))
        ;; flags |= (4a*r > bulk*q) | (r*r < limit*(aSq + z2))
        (local.set $flags
          (v128.or (local.get $flags)
            (v128.or
              (f64x2.gt (f64x2.mul (local.get $fourA) (local.get $r)) (f64x2.mul (local.get $B) (local.get $q)))
              (f64x2.lt (f64x2.mul (local.get $r) (local.get $r)) (f64x2.mul (local.get $L) (f64x2.add (local.get $aSq) (local.get $z2)))))))
        (local.set $i (i32.add (local.get $i) (i32.const 16)))
        (br $next)))
    (v128.any_true (local.get $flags)))
)
