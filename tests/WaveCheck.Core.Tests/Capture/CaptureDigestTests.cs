using System.Text;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The capture's content digest, against the SHA-256 test vectors of FIPS 180-2 Appendix B.</summary>
public sealed class CaptureDigestTests : IDisposable
{
    // FIPS 180-2 Appendix B.1: SHA-256("abc").
    private const string Abc = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

    // FIPS 180-2 Appendix B.3: SHA-256 of one million 'a' (spans many of the reader's 64 KiB blocks).
    private const string MillionA = "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0";

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Single_file_digest_is_its_sha256()
    {
        var path = _folder.Write("abc.wav", "abc");

        var identity = CaptureDigest.WithDigest(ReportIdentity.Empty, path);

        Assert.Equal(Abc, identity.CaptureSha256);
        Assert.Equal(Abc[..12], identity.CaptureDigest);
        Assert.Equal(["abc.wav"], identity.DigestFiles);
    }

    [Fact]
    public void File_longer_than_a_block_is_hashed_whole()
    {
        var path = _folder.File("a.csv");
        File.WriteAllBytes(path, Enumerable.Repeat((byte)'a', 1_000_000).ToArray());

        Assert.Equal(MillionA, CaptureDigest.Sha256([path]));
    }

    [Fact]
    public void Comtrade_cfg_and_dat_are_hashed_in_that_order()
    {
        // "ab" then "c" read one after the other is the message "abc": the digest covers both files, cfg first.
        var cfg = _folder.Write("rec.cfg", "ab");
        _folder.Write("rec.dat", "c");

        var identity = CaptureDigest.WithDigest(ReportIdentity.Empty, cfg);

        Assert.Equal(Abc, identity.CaptureSha256);
        Assert.Equal(["rec.cfg", "rec.dat"], identity.DigestFiles);
    }

    [Fact]
    public void Changing_one_byte_changes_the_digest()
    {
        var first = _folder.Write("one.wav", "abc");
        var second = _folder.Write("two.wav", "abd");

        Assert.NotEqual(CaptureDigest.Sha256([first]), CaptureDigest.Sha256([second]));
    }

    [Fact]
    public void Cfg_without_its_data_file_is_refused_with_the_expected_name()
    {
        var cfg = _folder.Write("lonely.cfg", "x");

        var e = Assert.Throws<CaptureFormatException>(() => CaptureDigest.FilesOf(cfg));

        Assert.Contains("lonely.dat", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Identity_over_a_fallback_keeps_its_own_values()
    {
        var own = new ReportIdentity { ReportNumber = "R-2", Circuit = "C1" };
        var site = new ReportIdentity { ReportNumber = "R-1", Client = "invented client", ProductTest = true };

        var merged = own.Over(site);

        Assert.Equal("R-2", merged.ReportNumber);
        Assert.Equal("C1", merged.Circuit);
        Assert.Equal("invented client", merged.Client);
        Assert.True(merged.ProductTest);
    }
}
