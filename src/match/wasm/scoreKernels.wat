;; Score kernels for the full-spectrum search: row-by-vector products over a row-major float32 (or int8) matrix.
;; Every kernel takes a half-open row range [r0, r1) first so a caller can split one job across threads.
;; Rows are `stride` elements long and stride is a multiple of 16, so the loops need no tail code: the
;; caller pads each row (and every query) with zeros. Pointers are byte offsets into the imported memory.
;; The memory line below is rewritten to `(memory 1 65536 shared)` for the variant that worker threads share.
(module
  (import "env" "memory" (memory 1 65536))

  ;; Sum of the four lanes of an f32x4.
  (func $hsum (param $v v128) (result f32)
    (f32.add
      (f32.add (f32x4.extract_lane 0 (local.get $v)) (f32x4.extract_lane 1 (local.get $v)))
      (f32.add (f32x4.extract_lane 2 (local.get $v)) (f32x4.extract_lane 3 (local.get $v)))))

  ;; out[r] = Σ_i mat[r, i] · vec[i] for r in [r0, r1); out is a float32 array indexed by the global row.
  (func (export "dotF32")
    (param $r0 i32) (param $r1 i32) (param $mat i32) (param $stride i32) (param $vec i32) (param $out i32)
    (local $r i32) (local $bytes i32) (local $p i32) (local $q i32) (local $end i32)
    (local $a0 v128) (local $a1 v128) (local $a2 v128) (local $a3 v128)
    (local.set $bytes (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $r (local.get $r0))
    (block $done
      (loop $rows
        (br_if $done (i32.ge_u (local.get $r) (local.get $r1)))
        (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $bytes))))
        (local.set $end (i32.add (local.get $p) (local.get $bytes)))
        (local.set $q (local.get $vec))
        (local.set $a0 (v128.const i32x4 0 0 0 0))
        (local.set $a1 (v128.const i32x4 0 0 0 0))
        (local.set $a2 (v128.const i32x4 0 0 0 0))
        (local.set $a3 (v128.const i32x4 0 0 0 0))
        ;; Four independent accumulators hide the latency of the adds.
        (loop $cols
          (local.set $a0 (f32x4.add (local.get $a0)
            (f32x4.mul (v128.load (local.get $p)) (v128.load (local.get $q)))))
          (local.set $a1 (f32x4.add (local.get $a1)
            (f32x4.mul (v128.load offset=16 (local.get $p)) (v128.load offset=16 (local.get $q)))))
          (local.set $a2 (f32x4.add (local.get $a2)
            (f32x4.mul (v128.load offset=32 (local.get $p)) (v128.load offset=32 (local.get $q)))))
          (local.set $a3 (f32x4.add (local.get $a3)
            (f32x4.mul (v128.load offset=48 (local.get $p)) (v128.load offset=48 (local.get $q)))))
          (local.set $p (i32.add (local.get $p) (i32.const 64)))
          (local.set $q (i32.add (local.get $q) (i32.const 64)))
          (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
        (f32.store
          (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 2)))
          (call $hsum (f32x4.add (f32x4.add (local.get $a0) (local.get $a1))
                                 (f32x4.add (local.get $a2) (local.get $a3)))))
        (local.set $r (i32.add (local.get $r) (i32.const 1)))
        (br $rows))))

  ;; out[j] = Σ_i mat[idx[j], i] · vec[i] for j in [j0, j1); idx is a uint32 array of row numbers. Used to
  ;; rescore the few candidate rows of the reduced-precision scan exactly.
  (func (export "dotF32Rows")
    (param $j0 i32) (param $j1 i32) (param $mat i32) (param $stride i32) (param $vec i32) (param $idx i32)
    (param $out i32)
    (local $j i32) (local $bytes i32) (local $p i32) (local $q i32) (local $end i32)
    (local $a0 v128) (local $a1 v128) (local $a2 v128) (local $a3 v128)
    (local.set $bytes (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $j (local.get $j0))
    (block $done
      (loop $rows
        (br_if $done (i32.ge_u (local.get $j) (local.get $j1)))
        (local.set $p (i32.add (local.get $mat)
          (i32.mul (i32.load (i32.add (local.get $idx) (i32.shl (local.get $j) (i32.const 2))))
                   (local.get $bytes))))
        (local.set $end (i32.add (local.get $p) (local.get $bytes)))
        (local.set $q (local.get $vec))
        (local.set $a0 (v128.const i32x4 0 0 0 0))
        (local.set $a1 (v128.const i32x4 0 0 0 0))
        (local.set $a2 (v128.const i32x4 0 0 0 0))
        (local.set $a3 (v128.const i32x4 0 0 0 0))
        ;; The same accumulation order as dotF32, so a rescored row gets bit for bit the score a full scan gives.
        (loop $cols
          (local.set $a0 (f32x4.add (local.get $a0)
            (f32x4.mul (v128.load (local.get $p)) (v128.load (local.get $q)))))
          (local.set $a1 (f32x4.add (local.get $a1)
            (f32x4.mul (v128.load offset=16 (local.get $p)) (v128.load offset=16 (local.get $q)))))
          (local.set $a2 (f32x4.add (local.get $a2)
            (f32x4.mul (v128.load offset=32 (local.get $p)) (v128.load offset=32 (local.get $q)))))
          (local.set $a3 (f32x4.add (local.get $a3)
            (f32x4.mul (v128.load offset=48 (local.get $p)) (v128.load offset=48 (local.get $q)))))
          (local.set $p (i32.add (local.get $p) (i32.const 64)))
          (local.set $q (i32.add (local.get $q) (i32.const 64)))
          (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
        (f32.store
          (i32.add (local.get $out) (i32.shl (local.get $j) (i32.const 2)))
          (call $hsum (f32x4.add (f32x4.add (local.get $a0) (local.get $a1))
                                 (f32x4.add (local.get $a2) (local.get $a3)))))
        (local.set $j (i32.add (local.get $j) (i32.const 1)))
        (br $rows))))

  ;; Blocked batch: out[q · outStride + r] = Σ_i mat[r, i] · queries[q, i] for r in [r0, r1), q < nq.
  ;; nq is a multiple of 4 (the caller pads with zero queries). Two rows meet four queries at a time, so every
  ;; row is read from memory once per block of queries and each query chunk serves two rows.
  (func (export "dotF32Batch")
    (param $r0 i32) (param $r1 i32) (param $mat i32) (param $stride i32) (param $queries i32) (param $nq i32)
    (param $out i32) (param $outStride i32)
    (local $r i32) (local $bytes i32) (local $g i32) (local $p i32) (local $q i32) (local $end i32)
    (local $x0 v128) (local $x1 v128) (local $y v128)
    (local $a00 v128) (local $a01 v128) (local $a02 v128) (local $a03 v128)
    (local $a10 v128) (local $a11 v128) (local $a12 v128) (local $a13 v128)
    (local $o i32) (local $plane i32)
    (local.set $bytes (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $plane (i32.shl (local.get $outStride) (i32.const 2)))
    (local.set $r (local.get $r0))
    (block $done
      (loop $pairs
        (br_if $done (i32.ge_u (i32.add (local.get $r) (i32.const 1)) (local.get $r1)))
        (local.set $g (i32.const 0))
        (loop $groups
          (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $bytes))))
          (local.set $end (i32.add (local.get $p) (local.get $bytes)))
          (local.set $q (i32.add (local.get $queries) (i32.mul (local.get $g) (local.get $bytes))))
          (local.set $a00 (v128.const i32x4 0 0 0 0)) (local.set $a01 (v128.const i32x4 0 0 0 0))
          (local.set $a02 (v128.const i32x4 0 0 0 0)) (local.set $a03 (v128.const i32x4 0 0 0 0))
          (local.set $a10 (v128.const i32x4 0 0 0 0)) (local.set $a11 (v128.const i32x4 0 0 0 0))
          (local.set $a12 (v128.const i32x4 0 0 0 0)) (local.set $a13 (v128.const i32x4 0 0 0 0))
          (loop $cols
            (local.set $x0 (v128.load (local.get $p)))
            (local.set $x1 (v128.load (i32.add (local.get $p) (local.get $bytes))))
            (local.set $y (v128.load (local.get $q)))
            (local.set $a00 (f32x4.add (local.get $a00) (f32x4.mul (local.get $x0) (local.get $y))))
            (local.set $a10 (f32x4.add (local.get $a10) (f32x4.mul (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (local.get $bytes))))
            (local.set $a01 (f32x4.add (local.get $a01) (f32x4.mul (local.get $x0) (local.get $y))))
            (local.set $a11 (f32x4.add (local.get $a11) (f32x4.mul (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (i32.shl (local.get $bytes) (i32.const 1)))))
            (local.set $a02 (f32x4.add (local.get $a02) (f32x4.mul (local.get $x0) (local.get $y))))
            (local.set $a12 (f32x4.add (local.get $a12) (f32x4.mul (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (i32.mul (local.get $bytes) (i32.const 3)))))
            (local.set $a03 (f32x4.add (local.get $a03) (f32x4.mul (local.get $x0) (local.get $y))))
            (local.set $a13 (f32x4.add (local.get $a13) (f32x4.mul (local.get $x1) (local.get $y))))
            (local.set $p (i32.add (local.get $p) (i32.const 16)))
            (local.set $q (i32.add (local.get $q) (i32.const 16)))
            (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
          (local.set $o (i32.add (local.get $out)
            (i32.add (i32.shl (local.get $r) (i32.const 2)) (i32.mul (local.get $g) (local.get $plane)))))
          (f32.store (local.get $o) (call $hsum (local.get $a00)))
          (f32.store offset=4 (local.get $o) (call $hsum (local.get $a10)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (f32.store (local.get $o) (call $hsum (local.get $a01)))
          (f32.store offset=4 (local.get $o) (call $hsum (local.get $a11)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (f32.store (local.get $o) (call $hsum (local.get $a02)))
          (f32.store offset=4 (local.get $o) (call $hsum (local.get $a12)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (f32.store (local.get $o) (call $hsum (local.get $a03)))
          (f32.store offset=4 (local.get $o) (call $hsum (local.get $a13)))
          (local.set $g (i32.add (local.get $g) (i32.const 4)))
          (br_if $groups (i32.lt_u (local.get $g) (local.get $nq))))
        (local.set $r (i32.add (local.get $r) (i32.const 2)))
        (br $pairs)))
    ;; An odd last row goes through the single-row kernel once per query.
    (if (i32.lt_u (local.get $r) (local.get $r1))
      (then
        (local.set $g (i32.const 0))
        (loop $tail
          (call $dotOne (local.get $r) (local.get $mat) (local.get $bytes)
            (i32.add (local.get $queries) (i32.mul (local.get $g) (local.get $bytes)))
            (i32.add (local.get $out)
              (i32.add (i32.shl (local.get $r) (i32.const 2)) (i32.mul (local.get $g) (local.get $plane)))))
          (local.set $g (i32.add (local.get $g) (i32.const 1)))
          (br_if $tail (i32.lt_u (local.get $g) (local.get $nq)))))))

  ;; One row against one vector, stored at the byte address `dst`.
  (func $dotOne (param $r i32) (param $mat i32) (param $bytes i32) (param $vec i32) (param $dst i32)
    (local $p i32) (local $q i32) (local $end i32) (local $a v128)
    (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $bytes))))
    (local.set $end (i32.add (local.get $p) (local.get $bytes)))
    (local.set $q (local.get $vec))
    (local.set $a (v128.const i32x4 0 0 0 0))
    (loop $cols
      (local.set $a (f32x4.add (local.get $a)
        (f32x4.mul (v128.load (local.get $p)) (v128.load (local.get $q)))))
      (local.set $p (i32.add (local.get $p) (i32.const 16)))
      (local.set $q (i32.add (local.get $q) (i32.const 16)))
      (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
    (f32.store (local.get $dst) (call $hsum (local.get $a))))

  ;; Reduced precision: out[r] = scale[r] · queryScale · Σ_i mat8[r, i] · q16[i], with int8 rows and an int16
  ;; query. Each i32 lane sums stride / 16 products, so the caller keeps |q16| ≤ 2³¹ · 16 / (127 · stride);
  ;; lanes are converted to float before the horizontal sum, which could overflow in int32.
  (func (export "dotI8")
    (param $r0 i32) (param $r1 i32) (param $mat i32) (param $stride i32) (param $vec i32) (param $scale i32)
    (param $queryScale f32) (param $out i32)
    (local $r i32) (local $p i32) (local $q i32) (local $end i32)
    (local $a0 v128) (local $a1 v128) (local $a2 v128) (local $a3 v128)
    (local.set $r (local.get $r0))
    (block $done
      (loop $rows
        (br_if $done (i32.ge_u (local.get $r) (local.get $r1)))
        (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $stride))))
        (local.set $end (i32.add (local.get $p) (local.get $stride)))
        (local.set $q (local.get $vec))
        (local.set $a0 (v128.const i32x4 0 0 0 0))
        (local.set $a1 (v128.const i32x4 0 0 0 0))
        (local.set $a2 (v128.const i32x4 0 0 0 0))
        (local.set $a3 (v128.const i32x4 0 0 0 0))
        ;; Sign-extending loads (8 bytes → 8 int16 lanes) cost one instruction each; 32 row bytes per turn.
        (loop $cols
          (local.set $a0 (i32x4.add (local.get $a0)
            (i32x4.dot_i16x8_s (v128.load8x8_s (local.get $p)) (v128.load (local.get $q)))))
          (local.set $a1 (i32x4.add (local.get $a1)
            (i32x4.dot_i16x8_s (v128.load8x8_s offset=8 (local.get $p)) (v128.load offset=16 (local.get $q)))))
          (local.set $a2 (i32x4.add (local.get $a2)
            (i32x4.dot_i16x8_s (v128.load8x8_s offset=16 (local.get $p)) (v128.load offset=32 (local.get $q)))))
          (local.set $a3 (i32x4.add (local.get $a3)
            (i32x4.dot_i16x8_s (v128.load8x8_s offset=24 (local.get $p)) (v128.load offset=48 (local.get $q)))))
          (local.set $p (i32.add (local.get $p) (i32.const 32)))
          (local.set $q (i32.add (local.get $q) (i32.const 64)))
          (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
        (f32.store
          (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 2)))
          (f32.mul
            (f32.mul
              (call $hsum (f32x4.add
                (f32x4.add (f32x4.convert_i32x4_s (local.get $a0)) (f32x4.convert_i32x4_s (local.get $a1)))
                (f32x4.add (f32x4.convert_i32x4_s (local.get $a2)) (f32x4.convert_i32x4_s (local.get $a3)))))
              (f32.load (i32.add (local.get $scale) (i32.shl (local.get $r) (i32.const 2)))))
            (local.get $queryScale)))
        (local.set $r (i32.add (local.get $r) (i32.const 1)))
        (br $rows))))

;; Reduced-precision batch: out[q · outStride + r] = scale[r] · queryScale[q] · Σ_i mat8[r, i] · q16[q, i]
  ;; for r in [r0, r1), q < nq (a multiple of 4); q16 holds nq int16 queries of stride values, queryScale nq
  ;; float32. Two int8 rows meet four queries at a time, as in dotF32Batch; each i32 lane sums stride / 4
  ;; products, so the caller keeps |q16| ≤ 2³¹ · 4 / (127 · stride).
  (func (export "dotI8Batch")
    (param $r0 i32) (param $r1 i32) (param $mat i32) (param $stride i32) (param $queries i32) (param $nq i32)
    (param $scale i32) (param $queryScale i32) (param $out i32) (param $outStride i32)
    (local $r i32) (local $g i32) (local $p i32) (local $q i32) (local $end i32) (local $qbytes i32)
    (local $plane i32) (local $o i32) (local $s0 f32) (local $s1 f32) (local $t f32)
    (local $x0 v128) (local $x1 v128) (local $y v128)
    (local $a00 v128) (local $a01 v128) (local $a02 v128) (local $a03 v128)
    (local $a10 v128) (local $a11 v128) (local $a12 v128) (local $a13 v128)
    (local.set $qbytes (i32.shl (local.get $stride) (i32.const 1)))
    (local.set $plane (i32.shl (local.get $outStride) (i32.const 2)))
    (local.set $r (local.get $r0))
    (block $done
      (loop $pairs
        (br_if $done (i32.ge_u (i32.add (local.get $r) (i32.const 1)) (local.get $r1)))
        (local.set $s0 (f32.load (i32.add (local.get $scale) (i32.shl (local.get $r) (i32.const 2)))))
        (local.set $s1 (f32.load offset=4 (i32.add (local.get $scale) (i32.shl (local.get $r) (i32.const 2)))))
        (local.set $g (i32.const 0))
        (loop $groups
          (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $stride))))
          (local.set $end (i32.add (local.get $p) (local.get $stride)))
          (local.set $q (i32.add (local.get $queries) (i32.mul (local.get $g) (local.get $qbytes))))
          (local.set $a00 (v128.const i32x4 0 0 0 0)) (local.set $a01 (v128.const i32x4 0 0 0 0))
          (local.set $a02 (v128.const i32x4 0 0 0 0)) (local.set $a03 (v128.const i32x4 0 0 0 0))
          (local.set $a10 (v128.const i32x4 0 0 0 0)) (local.set $a11 (v128.const i32x4 0 0 0 0))
          (local.set $a12 (v128.const i32x4 0 0 0 0)) (local.set $a13 (v128.const i32x4 0 0 0 0))
          (loop $cols
            (local.set $x0 (v128.load8x8_s (local.get $p)))
            (local.set $x1 (v128.load8x8_s (i32.add (local.get $p) (local.get $stride))))
            (local.set $y (v128.load (local.get $q)))
            (local.set $a00 (i32x4.add (local.get $a00) (i32x4.dot_i16x8_s (local.get $x0) (local.get $y))))
            (local.set $a10 (i32x4.add (local.get $a10) (i32x4.dot_i16x8_s (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (local.get $qbytes))))
            (local.set $a01 (i32x4.add (local.get $a01) (i32x4.dot_i16x8_s (local.get $x0) (local.get $y))))
            (local.set $a11 (i32x4.add (local.get $a11) (i32x4.dot_i16x8_s (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (i32.shl (local.get $qbytes) (i32.const 1)))))
            (local.set $a02 (i32x4.add (local.get $a02) (i32x4.dot_i16x8_s (local.get $x0) (local.get $y))))
            (local.set $a12 (i32x4.add (local.get $a12) (i32x4.dot_i16x8_s (local.get $x1) (local.get $y))))
            (local.set $y (v128.load (i32.add (local.get $q) (i32.mul (local.get $qbytes) (i32.const 3)))))
            (local.set $a03 (i32x4.add (local.get $a03) (i32x4.dot_i16x8_s (local.get $x0) (local.get $y))))
            (local.set $a13 (i32x4.add (local.get $a13) (i32x4.dot_i16x8_s (local.get $x1) (local.get $y))))
            (local.set $p (i32.add (local.get $p) (i32.const 8)))
            (local.set $q (i32.add (local.get $q) (i32.const 16)))
            (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
          (local.set $o (i32.add (local.get $out)
            (i32.add (i32.shl (local.get $r) (i32.const 2)) (i32.mul (local.get $g) (local.get $plane)))))
          (local.set $t (f32.load (i32.add (local.get $queryScale) (i32.shl (local.get $g) (i32.const 2)))))
          (f32.store (local.get $o) (f32.mul (f32.mul (call $hsumI (local.get $a00)) (local.get $s0)) (local.get $t)))
          (f32.store offset=4 (local.get $o)
            (f32.mul (f32.mul (call $hsumI (local.get $a10)) (local.get $s1)) (local.get $t)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (local.set $t (f32.load offset=4 (i32.add (local.get $queryScale) (i32.shl (local.get $g) (i32.const 2)))))
          (f32.store (local.get $o) (f32.mul (f32.mul (call $hsumI (local.get $a01)) (local.get $s0)) (local.get $t)))
          (f32.store offset=4 (local.get $o)
            (f32.mul (f32.mul (call $hsumI (local.get $a11)) (local.get $s1)) (local.get $t)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (local.set $t (f32.load offset=8 (i32.add (local.get $queryScale) (i32.shl (local.get $g) (i32.const 2)))))
          (f32.store (local.get $o) (f32.mul (f32.mul (call $hsumI (local.get $a02)) (local.get $s0)) (local.get $t)))
          (f32.store offset=4 (local.get $o)
            (f32.mul (f32.mul (call $hsumI (local.get $a12)) (local.get $s1)) (local.get $t)))
          (local.set $o (i32.add (local.get $o) (local.get $plane)))
          (local.set $t (f32.load offset=12 (i32.add (local.get $queryScale) (i32.shl (local.get $g) (i32.const 2)))))
          (f32.store (local.get $o) (f32.mul (f32.mul (call $hsumI (local.get $a03)) (local.get $s0)) (local.get $t)))
          (f32.store offset=4 (local.get $o)
            (f32.mul (f32.mul (call $hsumI (local.get $a13)) (local.get $s1)) (local.get $t)))
          (local.set $g (i32.add (local.get $g) (i32.const 4)))
          (br_if $groups (i32.lt_u (local.get $g) (local.get $nq))))
        (local.set $r (i32.add (local.get $r) (i32.const 2)))
        (br $pairs)))
    ;; An odd last row goes through the single-row int8 kernel once per query.
    (if (i32.lt_u (local.get $r) (local.get $r1))
      (then
        (local.set $g (i32.const 0))
        (loop $tail
          (call $dotOneI8 (local.get $r) (local.get $mat) (local.get $stride)
            (i32.add (local.get $queries) (i32.mul (local.get $g) (local.get $qbytes)))
            (f32.load (i32.add (local.get $scale) (i32.shl (local.get $r) (i32.const 2))))
            (f32.load (i32.add (local.get $queryScale) (i32.shl (local.get $g) (i32.const 2))))
            (i32.add (local.get $out)
              (i32.add (i32.shl (local.get $r) (i32.const 2)) (i32.mul (local.get $g) (local.get $plane)))))
          (local.set $g (i32.add (local.get $g) (i32.const 1)))
          (br_if $tail (i32.lt_u (local.get $g) (local.get $nq)))))))

  ;; Sum of the four int32 lanes, converted lane by lane to float first (their int32 sum could overflow).
  (func $hsumI (param $v v128) (result f32)
    (call $hsum (f32x4.convert_i32x4_s (local.get $v))))

  ;; One int8 row against one int16 query, times the row scale and then the query scale (the order the batch
  ;; kernel multiplies in, so a row scores alike wherever a thread's row range happens to split the pairs).
  (func $dotOneI8 (param $r i32) (param $mat i32) (param $stride i32) (param $vec i32) (param $rowScale f32)
    (param $queryScale f32) (param $dst i32)
    (local $p i32) (local $q i32) (local $end i32) (local $a v128)
    (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $stride))))
    (local.set $end (i32.add (local.get $p) (local.get $stride)))
    (local.set $q (local.get $vec))
    (local.set $a (v128.const i32x4 0 0 0 0))
    (loop $cols
      (local.set $a (i32x4.add (local.get $a)
        (i32x4.dot_i16x8_s (v128.load8x8_s (local.get $p)) (v128.load (local.get $q)))))
      (local.set $p (i32.add (local.get $p) (i32.const 8)))
      (local.set $q (i32.add (local.get $q) (i32.const 16)))
      (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
    (f32.store (local.get $dst)
      (f32.mul (f32.mul (call $hsumI (local.get $a)) (local.get $rowScale)) (local.get $queryScale))))

  ;; out[r] = Σ_i mat[r, i]: one plain read of every row, the memory-bandwidth floor any scan must pay.
  (func (export "sumF32")
    (param $r0 i32) (param $r1 i32) (param $mat i32) (param $stride i32) (param $out i32)
    (local $r i32) (local $bytes i32) (local $p i32) (local $end i32)
    (local $a0 v128) (local $a1 v128) (local $a2 v128) (local $a3 v128)
    (local.set $bytes (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $r (local.get $r0))
    (block $done
      (loop $rows
        (br_if $done (i32.ge_u (local.get $r) (local.get $r1)))
        (local.set $p (i32.add (local.get $mat) (i32.mul (local.get $r) (local.get $bytes))))
        (local.set $end (i32.add (local.get $p) (local.get $bytes)))
        (local.set $a0 (v128.const i32x4 0 0 0 0))
        (local.set $a1 (v128.const i32x4 0 0 0 0))
        (local.set $a2 (v128.const i32x4 0 0 0 0))
        (local.set $a3 (v128.const i32x4 0 0 0 0))
        (loop $cols
          (local.set $a0 (f32x4.add (local.get $a0) (v128.load (local.get $p))))
          (local.set $a1 (f32x4.add (local.get $a1) (v128.load offset=16 (local.get $p))))
          (local.set $a2 (f32x4.add (local.get $a2) (v128.load offset=32 (local.get $p))))
          (local.set $a3 (f32x4.add (local.get $a3) (v128.load offset=48 (local.get $p))))
          (local.set $p (i32.add (local.get $p) (i32.const 64)))
          (br_if $cols (i32.lt_u (local.get $p) (local.get $end))))
        (f32.store
          (i32.add (local.get $out) (i32.shl (local.get $r) (i32.const 2)))
          (call $hsum (f32x4.add (f32x4.add (local.get $a0) (local.get $a1))
                                 (f32x4.add (local.get $a2) (local.get $a3)))))
        (local.set $r (i32.add (local.get $r) (i32.const 1)))
        (br $rows))))
)
