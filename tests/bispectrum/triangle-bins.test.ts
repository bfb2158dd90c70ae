import { describe, expect, it } from 'vitest';
import { SHAPE_CLASSES, triangleShapeClasses, binsOfShapes, shapeClassOf } from '../../src/bispectrum/shape-classes.js';
import { enumerateTriangleBins, shellGrid } from '../../src/bispectrum/triangle-bins.js';

describe('triangle bins and shape classes', () => {
  it('counts 477 bins for centres 0.01–0.15, dk 0.01, and 6613 for 0.01–0.2, dk 0.005 (rule c1 - c2 - c3 < 1.5 dk, docs/conventions.md)', () => {
    expect(enumerateTriangleBins(shellGrid(0.01, 0.15, 0.01)).size).toBe(477);
    expect(enumerateTriangleBins(shellGrid(0.01, 0.2, 0.005)).size).toBe(6613);
  });

  it('brute-force count of the closing rule agrees with the enumeration (independent triple loop)', () => {
    const g = shellGrid(0.01, 0.08, 0.01);
    let n = 0;
    for (let i = 1; i <= 8; i++) for (let j = 1; j <= 8; j++) for (let l = 1; l <= 8; l++) {
      if (i >= j && j >= l && i - j - l < 1.5) n++;
    }
    expect(enumerateTriangleBins(g).size).toBe(n);
  });

  it('classifies by the documented thresholds, first match wins', () => {
    const dk = 0.01;
    expect(shapeClassOf(4, 4, 4, 0.05, 0.05, 0.05, dk)).toBe('equilateral');
    expect(shapeClassOf(9, 9, 1, 0.1, 0.1, 0.02, dk)).toBe('squeezed');
    expect(shapeClassOf(7, 3, 3, 0.08, 0.04, 0.04, dk)).toBe('flattened');
    expect(shapeClassOf(8, 4, 3, 0.09, 0.05, 0.04, dk)).toBe('flattened');
    expect(shapeClassOf(7, 7, 4, 0.08, 0.08, 0.05, dk)).toBe('isosceles');
    expect(shapeClassOf(8, 6, 4, 0.09, 0.07, 0.05, dk)).toBe('general');
  });

  it('every bin gets one class; 15 equilateral bins on 15 shells', () => {
    const bins = enumerateTriangleBins(shellGrid(0.01, 0.15, 0.01));
    const classes = triangleShapeClasses(bins);
    expect(classes.length).toBe(477);
    for (const c of classes) expect(SHAPE_CLASSES).toContain(c);
    expect(binsOfShapes(bins, ['equilateral']).length).toBe(15);
    const total = SHAPE_CLASSES.reduce((s, c) => s + binsOfShapes(bins, [c]).length, 0);
    expect(total).toBe(477);
  });
});
