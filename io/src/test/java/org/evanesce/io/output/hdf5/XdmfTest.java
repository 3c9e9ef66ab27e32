package org.evanesce.io.output.hdf5;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/** XDMF documents: well-formed XML whose every HDF reference names a dataset of the stated shape and precision. */
class XdmfTest {

    static final int NX = 9;
    static final int NY = 4;
    static final double CELL = 2.5e-8;
    static final double X0 = -1.0e-7;
    static final double Y0 = 5.0e-8;
    static final double[] TIMES = {0.0, 1.25e-15, 2.5e-15};

    @TempDir
    Path tmp;

    /**
     * Writes three frames (E_z float32, H_y float64) as frame-00000N.h5 and returns the temporal
     * XDMF document describing them; values are i + 100 j + 1000 n (+0.5 for H_y) for frame n.
     */
    static String writeSeries(Path dir) throws Exception {
        List<Xdmf.Grid> frames = new ArrayList<>();
        for (int n = 0; n < TIMES.length; n++) {
            String file = String.format("frame-%06d.h5", n);
            FieldDataset ez = new FieldDataset("E_z", Hdf5WriterTest.ramp(NX, NY, 1000.0 * n), NX, NY, Precision.SINGLE,
                    Map.of("unit", "V/m", "time", TIMES[n]));
            FieldDataset hy = new FieldDataset("H_y", Hdf5WriterTest.ramp(NX, NY, 1000.0 * n + 0.5), NX, NY,
                    Precision.DOUBLE, Map.of("unit", "A/m", "time", TIMES[n]));
            Hdf5Writer.write(dir.resolve(file), Map.of("frame", n), List.of(ez, hy));
            frames.add(new Xdmf.Grid("frame " + n, TIMES[n], NX, NY, X0, Y0, CELL,
                    List.of(Xdmf.Attribute.of("E_z", file, ez), Xdmf.Attribute.of("H_y", file, hy))));
        }
        return Xdmf.temporal("fields", frames);
    }

    static Document parse(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        DocumentBuilder b = f.newDocumentBuilder();
        return b.parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void aTimeSeriesPointsAtExistingDatasetsOfTheStatedShapeInTimeOrder() throws Exception {
        String xml = writeSeries(tmp);
        Files.writeString(tmp.resolve("fields.xmf"), xml);
        Document doc = parse(xml);
        Element root = doc.getDocumentElement();
        assertEquals("Xdmf", root.getTagName());
        assertEquals("3.0", root.getAttribute("Version"));
        Element collection = only(only(root, "Domain"), "Grid");
        assertEquals("Collection", collection.getAttribute("GridType"));
        assertEquals("Temporal", collection.getAttribute("CollectionType"));
        List<Element> grids = children(collection, "Grid");
        assertEquals(TIMES.length, grids.size());
        double last = Double.NEGATIVE_INFINITY;
        for (int n = 0; n < grids.size(); n++) {
            Element g = grids.get(n);
            double t = Double.parseDouble(only(g, "Time").getAttribute("Value"));
            assertEquals(TIMES[n], t, 0.0, "frame " + n + ": time written exactly");
            assertTrue(t > last, "times increase at frame " + n);
            last = t;
            checkGrid(g, NX, NY, X0, Y0, 2);
        }
    }

    /**
     * Writes dft.h5 (E_z_real, E_z_imaginary: float64, NX x NY, values i + 100 j + 0.1 and + 0.2) and
     * maps/eps.h5 (relative_permittivity_z: float32, one node more each way, half a cell lower left) and returns the
     * spatial XDMF document describing them.
     */
    static String writeMaps(Path dir) throws Exception {
        FieldDataset re = new FieldDataset("E_z_real", Hdf5WriterTest.ramp(NX, NY, 0.1), NX, NY, Precision.DOUBLE, Map.of());
        FieldDataset im = new FieldDataset("E_z_imaginary", Hdf5WriterTest.ramp(NX, NY, 0.2), NX, NY, Precision.DOUBLE, Map.of());
        Hdf5Writer.write(dir.resolve("dft.h5"), Map.of("frequency", 3.0e14), List.of(re, im));
        FieldDataset eps = new FieldDataset("relative_permittivity_z", Hdf5WriterTest.ramp(NX + 1, NY + 1, 0.0), NX + 1, NY + 1,
                Precision.SINGLE, Map.of());
        Files.createDirectories(dir.resolve("maps"));
        Hdf5Writer.write(dir.resolve("maps/eps.h5"), Map.of(), List.of(eps));
        return Xdmf.spatial("maps at 300 THz", List.of(
                new Xdmf.Grid("E_z", NX, NY, X0, Y0, CELL,
                        List.of(Xdmf.Attribute.of("E_z_real", "dft.h5", re), Xdmf.Attribute.of("E_z_imaginary", "dft.h5", im))),
                new Xdmf.Grid("permittivity", NX + 1, NY + 1, X0 - CELL / 2, Y0 - CELL / 2, CELL,
                        List.of(Xdmf.Attribute.of("relative_permittivity_z", "maps/eps.h5", eps)))));
    }

    @Test
    void frequencyMapsAndPermittivityInOneSpatialCollection() throws Exception {
        String xml = writeMaps(tmp);
        Files.writeString(tmp.resolve("maps.xmf"), xml);
        Element collection = only(only(parse(xml).getDocumentElement(), "Domain"), "Grid");
        assertEquals("Spatial", collection.getAttribute("CollectionType"));
        List<Element> grids = children(collection, "Grid");
        assertEquals(2, grids.size());
        assertEquals(0, children(grids.get(0), "Time").size(), "no time without one");
        checkGrid(grids.get(0), NX, NY, X0, Y0, 2);
        checkGrid(grids.get(1), NX + 1, NY + 1, X0 - CELL / 2, Y0 - CELL / 2, 1);
    }

    /** Topology, geometry (Z Y X order) and every HDF DataItem of one uniform grid. */
    private void checkGrid(Element g, int nx, int ny, double x0, double y0, int fields) throws Exception {
        String c = "grid " + g.getAttribute("Name");
        assertEquals("Uniform", g.getAttribute("GridType"), c);
        Element topology = only(g, "Topology");
        assertEquals("3DCoRectMesh", topology.getAttribute("TopologyType"), c);
        int[] dims = ints(topology.getAttribute("Dimensions"));
        assertArrayEquals(new int[] {1, ny, nx}, dims, c + ": topology Z Y X");
        Element geometry = only(g, "Geometry");
        assertEquals("ORIGIN_DXDYDZ", geometry.getAttribute("GeometryType"), c);
        List<Element> items = children(geometry, "DataItem");
        assertEquals(2, items.size(), c + ": origin and spacing");
        assertArrayEquals(new double[] {0, y0, x0}, doubles(items.get(0).getTextContent()), 0.0, c + ": origin Z Y X");
        assertArrayEquals(new double[] {CELL, CELL, CELL}, doubles(items.get(1).getTextContent()), 0.0, c + ": spacing");
        List<Element> attributes = children(g, "Attribute");
        assertEquals(fields, attributes.size(), c);
        for (Element a : attributes) {
            String ca = c + ", attribute " + a.getAttribute("Name");
            assertEquals("Node", a.getAttribute("Center"), ca);
            assertEquals("Scalar", a.getAttribute("AttributeType"), ca);
            Element item = only(a, "DataItem");
            assertEquals("HDF", item.getAttribute("Format"), ca);
            assertEquals("Float", item.getAttribute("NumberType"), ca);
            assertArrayEquals(dims, ints(item.getAttribute("Dimensions")), ca + ": same dimensions as the topology");
            String ref = item.getTextContent().trim();
            int colon = ref.indexOf(':');
            assertTrue(colon > 0, ca + ": 'file:/dataset' expected, got " + ref);
            Path file = tmp.resolve(ref.substring(0, colon));
            assertTrue(Files.isRegularFile(file), ca + ": file " + file + " exists");
            try (HdfFile h = new HdfFile(file)) {
                Dataset d = h.getDatasetByPath(ref.substring(colon + 1));
                assertArrayEquals(Arrays.copyOfRange(dims, 1, 3), d.getDimensions(), ca + ": HDF5 shape is Dimensions less the Z layer");
                assertEquals(Integer.parseInt(item.getAttribute("Precision")), d.getDataType().getSize(), ca + ": precision");
            }
        }
    }

    /**
     * Writes maps.h5 ({@link Hdf5WriterTest#sampleStack}, NX by NY: E_z_real of three layers and wavelength_m) and returns a
     * spatial XDMF document with one grid per layer, each naming its layer of the stack.
     */
    static String writeStack(Path dir) throws Exception {
        List<Hdf5Dataset> sets = Hdf5WriterTest.sampleStack(NX, NY);
        Hdf5Writer.write(dir.resolve("maps.h5"), Map.of(), sets);
        FieldStack stack = (FieldStack) sets.get(1);
        List<Xdmf.Grid> grids = new ArrayList<>();
        for (int k = 0; k < stack.layers().size(); k++) {
            grids.add(new Xdmf.Grid("map " + k, NX, NY, X0, Y0, CELL,
                    List.of(Xdmf.Attribute.of("E_z_real", "maps.h5", stack, k))));
        }
        return Xdmf.spatial("maps", grids);
    }

    @Test
    void aLayerOfAStackIsAHyperSlabOfTheStoredDataset() throws Exception {
        String xml = writeStack(tmp);
        Element collection = only(only(parse(xml).getDocumentElement(), "Domain"), "Grid");
        List<Element> grids = children(collection, "Grid");
        int nx = NX;
        int ny = NY;
        int layers = Hdf5WriterTest.WAVELENGTHS.length;
        assertEquals(layers, grids.size(), "one grid per layer");
        try (HdfFile h = new HdfFile(tmp.resolve("maps.h5"))) {
            Dataset d = h.getDatasetByPath("/E_z_real");
            float[][][] stored = (float[][][]) d.getData();
            for (int k = 0; k < layers; k++) {
                String c = "grid " + k;
                Element slab = only(only(grids.get(k), "Attribute"), "DataItem");
                assertEquals("HyperSlab", slab.getAttribute("ItemType"), c);
                assertArrayEquals(new int[] {1, ny, nx}, ints(slab.getAttribute("Dimensions")), c + ": one Z layer of the topology");
                List<Element> parts = children(slab, "DataItem");
                assertEquals(2, parts.size(), c + ": selection and data");
                int[] sel = ints(parts.get(0).getTextContent());
                assertArrayEquals(new int[] {k, 0, 0, 1, 1, 1, 1, ny, nx}, sel, c + ": start, stride, count");
                assertEquals("HDF", parts.get(1).getAttribute("Format"), c);
                assertArrayEquals(d.getDimensions(), ints(parts.get(1).getAttribute("Dimensions")), c + ": the stored shape");
                assertEquals("maps.h5:/E_z_real", parts.get(1).getTextContent().trim(), c);
                // the selected layer holds layer k's values (i + 100 j + 1000 k + 0.1)
                assertEquals((float) (3 + 100 * 2 + 1000 * k + 0.1), stored[sel[0]][2][3], c + ": value at i = 3, j = 2");
            }
        }
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Attribute("E_z_real", "maps.h5", "E_z_real", 4, 3, 3),
                "layer beyond the stack");
    }

    @Test
    void namesAreEscaped() throws Exception {
        String awkward = "E & H <\"a\"> 'b'";
        String xml = Xdmf.spatial(awkward, List.of(new Xdmf.Grid(awkward, 2, 2, 0, 0, 1,
                List.of(new Xdmf.Attribute(awkward, "a&b <c>.h5", "/E", 4)))));
        Element collection = only(only(parse(xml).getDocumentElement(), "Domain"), "Grid");
        assertEquals(awkward, collection.getAttribute("Name"));
        Element grid = only(collection, "Grid");
        assertEquals(awkward, grid.getAttribute("Name"));
        Element attribute = only(grid, "Attribute");
        assertEquals(awkward, attribute.getAttribute("Name"));
        assertEquals("a&b <c>.h5:/E", only(attribute, "DataItem").getTextContent());
        assertThrows(IllegalArgumentException.class, () -> Xdmf.escape("bell\u0007"), "control character");
    }

    @Test
    void invalidSeriesAreRefused() {
        List<Xdmf.Attribute> a = List.of(new Xdmf.Attribute("E_z", "f.h5", "E_z", 4));
        assertEquals("/E_z", a.get(0).dataset(), "leading '/' added");
        Xdmf.Grid t1 = new Xdmf.Grid("a", 1.0, 2, 2, 0, 0, 1, a);
        Xdmf.Grid t0 = new Xdmf.Grid("b", 0.5, 2, 2, 0, 0, 1, a);
        Xdmf.Grid none = new Xdmf.Grid("c", 2, 2, 0, 0, 1, a);
        assertThrows(IllegalArgumentException.class, () -> Xdmf.temporal("s", List.of(t1, t0)), "time goes back");
        assertThrows(IllegalArgumentException.class, () -> Xdmf.temporal("s", List.of(t1, t1)), "time repeats");
        assertThrows(IllegalArgumentException.class, () -> Xdmf.temporal("s", List.of(t1, none)), "frame without time");
        assertThrows(IllegalArgumentException.class, () -> Xdmf.temporal("s", List.of()), "no frames");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Grid("g", 2, 2, 0, 0, 0.0, a), "zero spacing");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Grid("g", 2, 2, Double.NaN, 0, 1, a), "NaN origin");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Attribute("E_z", "f.h5", "E_z", 2), "precision 2");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Attribute("E_z", "/abs/f.h5", "E_z", 4), "absolute file");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Attribute("E_z", "c:f.h5", "E_z", 4), "':' in file");
        assertThrows(IllegalArgumentException.class, () -> new Xdmf.Grid("g", 2, 2, 0, 0, 1, List.of(a.get(0), a.get(0))),
                "repeated attribute");
    }

    static Element only(Element parent, String tag) {
        List<Element> c = children(parent, tag);
        assertEquals(1, c.size(), "one <" + tag + "> in <" + parent.getTagName() + " " + parent.getAttribute("Name") + ">");
        return c.get(0);
    }

    static List<Element> children(Element parent, String tag) {
        List<Element> out = new ArrayList<>();
        NodeList nodes = parent.getChildNodes();
        for (int k = 0; k < nodes.getLength(); k++) {
            if (nodes.item(k) instanceof Element e && e.getTagName().equals(tag)) {
                out.add(e);
            }
        }
        return out;
    }

    private static int[] ints(String text) {
        return Arrays.stream(text.trim().split("\\s+")).mapToInt(Integer::parseInt).toArray();
    }

    private static double[] doubles(String text) {
        return Arrays.stream(text.trim().split("\\s+")).mapToDouble(Double::parseDouble).toArray();
    }
}
